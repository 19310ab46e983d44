import "server-only";
import { publicOrigins } from "@/lib/http/origin";

// scripts/start.sh and scripts/test.sh export these; the defaults match npm start's.

/** Where links in mail point: the address people open the app at (the first of APP_ORIGIN's list). */
export function appOrigin(): string {
  return publicOrigins()[0]!;
}

export function smtpSettings(): { host: string; port: number } {
  return { host: process.env.SMTP_HOST || "127.0.0.1", port: Number(process.env.SMTP_PORT || 2525) };
}

export const MAIL_FROM = { name: "Trailbin", address: "no-reply@trailbin.example" };
