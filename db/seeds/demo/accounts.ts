import type { Role } from "../../../lib/contracts/users";

// Invented people of the invented Fennick Supply Co.; these passwords exist only in demo databases.
export const DEMO_SITE = {
  code: "BRAMBLEGATE",
  name: "Fennick Supply Co. — Bramblegate warehouse",
  timezone: "Europe/London",
} as const;

export const DEMO_ACCOUNTS: { email: string; displayName: string; role: Role; password: string }[] = [
  { email: "admin@bramblegate.example", displayName: "Ines Okafor", role: "admin", password: "bramblegate-admin" },
  {
    email: "planner@bramblegate.example",
    displayName: "Tomasz Reid",
    role: "planner",
    password: "bramblegate-planner",
  },
  { email: "picker@bramblegate.example", displayName: "Priya Lund", role: "picker", password: "bramblegate-picker" },
  { email: "picker2@bramblegate.example", displayName: "Joel Amara", role: "picker", password: "bramblegate-picker2" },
  {
    email: "supervisor@bramblegate.example",
    displayName: "Maren Osei",
    role: "supervisor",
    password: "bramblegate-supervisor",
  },
];
