// Printed by npm start so nobody has to look the demo sign-ins up.
import { DEMO_ACCOUNTS } from "../db/seeds/demo/accounts";

const rows = DEMO_ACCOUNTS.map((a) => [a.role, a.email, a.password, a.displayName]);
const widths = [0, 1, 2, 3].map((i) =>
  Math.max(...rows.map((r) => r[i]!.length), ["role", "e-mail", "password", "name"][i]!.length),
);
const line = (r: string[]) => "  " + r.map((c, i) => c.padEnd(widths[i]!)).join("   ");
console.log("Demo accounts:");
console.log(line(["role", "e-mail", "password", "name"]));
for (const r of rows) console.log(line(r));
