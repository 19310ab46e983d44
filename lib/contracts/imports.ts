// The spreadsheet imports' API (app/api/imports/[kind]/…) as the import panel reads it. Types only.
import type { RowProblem } from "@/lib/sheets/columns";

export type { RowProblem };

export type ImportCounts = {
  rows: number;
  items?: number;
  inserted?: number;
  updated?: number;
  orders?: number;
  lines?: number;
};

/** POST /api/imports/[kind]/preview */
export type PreviewAnswer = {
  headers: string[];
  mapping: Record<string, number | null>;
  fields: { key: string; label: string; required: boolean }[];
  preview: string[][];
  problems: RowProblem[];
  counts: ImportCounts;
  duplicate: { importedAt: string; filename: string } | null;
};

export type AlreadyImported = { alreadyImported: true; importedAt: string; filename: string; counts: ImportCounts };

/** POST /api/imports/[kind]: 201 { counts } or 200 { alreadyImported, … } */
export type ImportAnswer = { counts: ImportCounts; alreadyImported?: undefined } | AlreadyImported;
