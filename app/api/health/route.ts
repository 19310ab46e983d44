import { route } from "@/lib/http/route";
import { databaseAnswers } from "@/db/health";
import { DB_RETRY_AFTER_S } from "@/lib/http/db-errors";

export const GET = route({ access: "public" }, async () => {
  const database = await databaseAnswers();
  if (!database.ok) {
    return Response.json(
      { status: "unavailable", database: "database unavailable" },
      { status: 503, headers: { "Retry-After": String(DB_RETRY_AFTER_S) } },
    );
  }
  return Response.json({ status: "ok", database: "ok", migrations: database.migrations });
});
