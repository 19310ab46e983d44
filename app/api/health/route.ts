import { route } from "@/lib/http/route";
import { databaseAnswers } from "@/db/health";

export const dynamic = "force-dynamic";

export const GET = route({ access: "public" }, async () => {
  const database = await databaseAnswers();
  if (!database.ok) {
    return Response.json({ status: "unavailable", database: "The database does not answer: " + database.error }, { status: 503 });
  }
  return Response.json({ status: "ok", database: "ok", migrations: database.migrations });
});
