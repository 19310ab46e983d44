import type { WaveSettings } from "@/lib/contracts/waves";

/** The layout version's depots and drop-offs a cart can start and end at. */
export type CartEnds = { depots: { id: string; name: string }[]; dropoffs: { id: string; name: string }[] };

/** The settings the cart fields hold, as a wave's body sends them. */
export function readCartSettings(f: FormData): WaveSettings {
  return {
    totesPerCart: Number(f.get("totesPerCart")),
    maxLines: Number(f.get("maxLines")),
    maxWeightG: Math.round(Number(f.get("maxWeightKg")) * 1000),
    depotId: String(f.get("depotId")),
    dropoffId: String(f.get("dropoffId")),
    method: String(f.get("method")) as WaveSettings["method"],
  };
}

/**
 * A wave's cart limits, depot and drop-off and batching method, with the caution about cart weight:
 * the same fields when a wave is started and when it is edited. Uncontrolled; read with `readCartSettings`.
 * A depot or drop-off left out of `defaults` starts at the first one listed.
 */
export function CartSettingsFields({
  legend,
  defaults,
  ends,
}: {
  legend: string;
  defaults: Omit<WaveSettings, "depotId" | "dropoffId"> & Partial<Pick<WaveSettings, "depotId" | "dropoffId">>;
  ends: CartEnds | undefined;
}) {
  return (
    <>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="label">{legend}</legend>
        <label>
          <span className="label text-sm">Totes per cart (one order per tote)</span>
          <input
            name="totesPerCart"
            type="number"
            min={1}
            max={40}
            defaultValue={defaults.totesPerCart}
            className="field"
          />
        </label>
        <label>
          <span className="label text-sm">Most lines per batch</span>
          <input name="maxLines" type="number" min={1} max={500} defaultValue={defaults.maxLines} className="field" />
        </label>
        <label>
          <span className="label text-sm">Most weight per cart (kg)</span>
          <input
            name="maxWeightKg"
            type="number"
            min={1}
            step="0.5"
            defaultValue={defaults.maxWeightG / 1000}
            className="field"
          />
        </label>
        <label>
          <span className="label text-sm">Carts start at</span>
          <select name="depotId" className="field" defaultValue={defaults.depotId}>
            {ends?.depots.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name} ({d.id})
              </option>
            ))}
          </select>
        </label>
        <label>
          <span className="label text-sm">Carts end at</span>
          <select name="dropoffId" className="field" defaultValue={defaults.dropoffId}>
            {ends?.dropoffs.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name} ({d.id})
              </option>
            ))}
          </select>
        </label>
        <label>
          <span className="label text-sm">Batching</span>
          <select name="method" className="field" defaultValue={defaults.method}>
            <option value="savings">By route savings (least added walking)</option>
            <option value="first-come">First come, by cut-off</option>
          </select>
        </label>
      </fieldset>
      <p className="text-sm text-ink-soft">
        Check the cart weight limit against your site&apos;s rules for pushing carts and lifting; Trailbin does not know
        them.
      </p>
    </>
  );
}
