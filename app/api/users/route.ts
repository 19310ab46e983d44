import { z } from "zod";
import { route } from "@/lib/http/route";
import { listUsers } from "@/db/users";
import { addUser } from "@/lib/users/create-user";
import { ROLES } from "@/lib/auth/permissions";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { hasControlCharacters, isValidAddress } from "@/lib/mail/headers";

const NewUser = z.object({
  email: z
    .string()
    .trim()
    .max(254)
    .email("Enter a valid e-mail address.")
    // The address also goes into mail headers: plain local@domain only.
    .refine((e) => isValidAddress(e.toLowerCase()), "Enter a plain e-mail address like name@example.com."),
  displayName: z
    .string()
    .trim()
    .min(1, "Enter the person's name.")
    .max(120, "Keep the name under 120 characters.")
    // The name goes into the To: header of the invitation; a line break there would add headers.
    .refine((n) => !hasControlCharacters(n), "The name may not contain line breaks or control characters."),
  role: z.enum(ROLES, { message: "Choose a role: admin, planner, picker or supervisor." }),
  // Without a password the person gets an invitation mail and chooses one themselves.
  password: z
    .string()
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters for the first password.`)
    .max(1024, "That password is too long.")
    .optional(),
});

export const GET = route({ access: "users.manage" }, async ({ user }) =>
  Response.json({ users: await listUsers(user.siteId) }),
);

export const POST = route({ access: "users.manage", body: NewUser }, async ({ user, body, ip }) =>
  Response.json(await addUser(user, body, ip), { status: 201 }),
);
