/** What a pick list's barcode says: wave and batch, e.g. "W2-B05"; handhelds scan it to open the batch. */
export function batchLabel(waveId: number, number: number): string {
  return `W${waveId}-B${String(number).padStart(2, "0")}`;
}
