import { route } from "@/lib/http/route";
import { listItems } from "@/db/items";
import { BIN_SEPARATOR } from "@/lib/imports/fields";
import { TEMPLATE_SHEET, templateHeader } from "@/lib/imports/template";
import { downloadResponse, workbookBytes } from "@/lib/sheets/write";

// The template's columns, so an exported item master can be edited and imported back as it is.
// workbookBytes escapes every text cell that a spreadsheet would run as a formula.
export const GET = route({ access: "waves.read" }, async ({ user }) => {
  const items = await listItems(user.siteId);
  const rows = items.map((i) => [i.sku, i.description, i.uom, i.unitWeightG, i.bins.join(`${BIN_SEPARATOR} `)]);
  const day = new Date().toISOString().slice(0, 10);
  return downloadResponse(
    workbookBytes(TEMPLATE_SHEET.items, [templateHeader("items"), ...rows]),
    `item-master-${day}.xlsx`,
    "xlsx",
  );
});
