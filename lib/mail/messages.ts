import { headerText } from "./headers";

// The words of each mail. Pure: the link is built by the caller from APP_ORIGIN and the token.

export function setPasswordLink(origin: string, token: string): string {
  return `${origin}/set-password?token=${encodeURIComponent(token)}`;
}

export function invitationMail(p: { to: string; name: string; siteName: string; invitedBy: string; link: string }) {
  const name = headerText(p.name, 120);
  return {
    to: p.to,
    toName: name,
    subject: headerText(`You have a Trailbin account at ${p.siteName}`),
    text: [
      `Hello ${name},`,
      "",
      `${headerText(p.invitedBy, 120)} has made you a Trailbin account at ${p.siteName}.`,
      "Choose your password with this link (it works once, for 72 hours):",
      "",
      p.link,
      "",
      "Then sign in with this e-mail address and that password.",
      "If you did not expect this, ignore this mail and tell your site's layout admin.",
    ].join("\n"),
  };
}

export function resetMail(p: { to: string; name: string; link: string }) {
  const name = headerText(p.name, 120);
  return {
    to: p.to,
    toName: name,
    subject: "Reset your Trailbin password",
    text: [
      `Hello ${name},`,
      "",
      "Someone (hopefully you) asked to reset the password of your Trailbin account.",
      "Choose a new password with this link (it works once, for 1 hour):",
      "",
      p.link,
      "",
      "Setting a new password signs you out on every device.",
      "If you did not ask for this, ignore this mail: your password stays as it is.",
    ].join("\n"),
  };
}
