"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { patchJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { formatDate, formatDateTime, formatTime, type Clock, type DateOrder } from "@/lib/format/dates";
import { isTimeZone } from "@/lib/format/time-zones";
import { estimateSeconds, setupText, speedText, timingNote } from "@/lib/batching/estimate";
import { distance, minutes } from "@/lib/format/units";
import { SITE_LIMITS as L, type SiteDTO, type Units } from "@/lib/contracts/site";

type Form = {
  name: string;
  timezone: string;
  dateOrder: DateOrder;
  clock: Clock;
  units: Units;
  walkingSpeed: string;
  secondsPerLine: string;
  setupSeconds: string;
  cap: string;
};

const formOf = (s: SiteDTO): Form => ({
  name: s.name,
  timezone: s.timezone,
  dateOrder: s.dateOrder,
  clock: s.clock,
  units: s.units,
  walkingSpeed: String(s.walkingSpeedMmPerS / 1000),
  secondsPerLine: String(s.secondsPerLine),
  setupSeconds: String(s.setupSecondsPerBatch),
  cap: String(s.maxOpenBatchesPerPicker),
});

// An empty field is sent as it is typed (not as 0), so the server names it.
const num = (v: string) => (v.trim() === "" ? v : Number(v));

// The server names fields as the API does; people see the form's words.
const FIELD_LABELS: Record<string, string> = {
  name: "Site name",
  timezone: "Time zone",
  walkingSpeedMPerS: "Walking speed",
  secondsPerLine: "Time per pick line",
  setupSecondsPerBatch: "Set-up time per batch",
  maxOpenBatchesPerPicker: "Open batches per picker",
  dateOrder: "Date order",
  clock: "Clock",
  units: "Units",
};

// The sample batch of the preview: a typical cart of a busy morning.
const SAMPLE = { distanceMm: 180_000, lines: 12 };

export function SiteSettingsForm({ initial, nowIso, zones }: { initial: SiteDTO; nowIso: string; zones: string[] }) {
  const router = useRouter();
  const [site, setSite] = useState(initial);
  const [f, setF] = useState<Form>(() => formOf(initial));
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [now, setNow] = useState(() => new Date(nowIso));
  useEffect(() => {
    const t = setInterval(() => setNow(new Date()), 30_000);
    return () => clearInterval(t);
  }, []);

  const set = (k: keyof Form) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setF((old) => ({ ...old, [k]: e.target.value }));

  const zoneOk = isTimeZone(f.timezone.trim());
  const style = { timeZone: zoneOk ? f.timezone.trim() : site.timezone, dateOrder: f.dateOrder, clock: f.clock };
  const speed = Number(f.walkingSpeed);
  const perLine = Number(f.secondsPerLine);
  const setup = Number(f.setupSeconds);
  const within = (v: number, r: { min: number; max: number }) => v >= r.min && v <= r.max;
  const timingOk =
    [f.walkingSpeed, f.secondsPerLine, f.setupSeconds].every((v) => v.trim() !== "") &&
    within(speed, L.walkingSpeedMPerS) &&
    within(perLine, L.secondsPerLine) &&
    within(setup, L.setupSecondsPerBatch);
  const timing = {
    walkingSpeedMmPerS: Math.round(speed * 1000),
    secondsPerLine: perLine,
    setupSecondsPerBatch: setup,
  };

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    setBusy(true);
    setSaved(null);
    const r = await patchJson<{ site: SiteDTO; changed: string[] }>("/api/site", {
      version: site.version,
      name: f.name,
      timezone: f.timezone.trim(),
      dateOrder: f.dateOrder,
      clock: f.clock,
      units: f.units,
      walkingSpeedMPerS: num(f.walkingSpeed),
      secondsPerLine: num(f.secondsPerLine),
      setupSecondsPerBatch: num(f.setupSeconds),
      maxOpenBatchesPerPicker: num(f.cap),
    });
    setBusy(false);
    if (!r.ok) {
      setFailure({ ...r, issues: r.issues?.map((i) => ({ ...i, path: FIELD_LABELS[i.path] ?? i.path })) });
      const theirs = (r.body as { site?: SiteDTO } | undefined)?.site;
      if (r.status === 409 && theirs) {
        setSite(theirs);
        setF(formOf(theirs));
      }
      return;
    }
    setFailure(null);
    setSite(r.data.site);
    setF(formOf(r.data.site));
    setSaved(
      r.data.changed.length === 0
        ? "Nothing had changed; the settings are as they were."
        : "Saved. Every screen, mail, print and estimate uses the new settings from now on.",
    );
    // The app shell hands the date style to every screen: render it again with the new one.
    router.refresh();
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-6" aria-label="Site settings">
      <section className="card space-y-4" aria-labelledby="site-title">
        <h2 id="site-title">Site</h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <label>
            <span className="label">Site name</span>
            <input className="field" name="name" value={f.name} onChange={set("name")} maxLength={L.nameMax} />
          </label>
          <label>
            <span className="label">Time zone (IANA name)</span>
            <input
              className="field"
              name="timezone"
              list="time-zones"
              value={f.timezone}
              onChange={set("timezone")}
              aria-invalid={!zoneOk}
              autoComplete="off"
            />
            <datalist id="time-zones">
              {zones.map((z) => (
                <option key={z} value={z} />
              ))}
            </datalist>
            {!zoneOk && (
              <span className="mt-1 block text-sm text-alarm">
                Not a time zone Trailbin knows: pick one from the list, such as Europe/London.
              </span>
            )}
          </label>
        </div>
      </section>

      <section className="card space-y-4" aria-labelledby="formats-title">
        <h2 id="formats-title">Dates, times and units</h2>
        <div className="grid gap-4 sm:grid-cols-3">
          <label>
            <span className="label">Date order</span>
            <select className="field" name="dateOrder" value={f.dateOrder} onChange={set("dateOrder")}>
              <option value="dmy">Day/month/year (03/12/2026)</option>
              <option value="mdy">Month/day/year (12/03/2026)</option>
              <option value="ymd">Year-month-day (2026-12-03)</option>
            </select>
          </label>
          <label>
            <span className="label">Clock</span>
            <select className="field" name="clock" value={f.clock} onChange={set("clock")}>
              <option value="24h">24-hour (14:30)</option>
              <option value="12h">12-hour (2:30 PM)</option>
            </select>
          </label>
          <label>
            <span className="label">Units</span>
            <select className="field" name="units" value={f.units} onChange={set("units")}>
              <option value="metric">Metric (metres, m/s)</option>
              <option value="imperial">Imperial (feet, ft/s)</option>
            </select>
          </label>
        </div>
        <p className="text-sm text-ink-soft">
          Units change the walking speed in the notes beside estimates (m/s or ft/s) and the wave summary&apos;s planned
          and usual walks (metres or feet). Batch tables, charts, pick lists and the handheld show metres either way;
          walking speed is entered in m/s either way.
        </p>
        <div role="status" aria-live="polite" className="notice-info" data-testid="date-preview">
          <p className="font-semibold">Preview, at this moment in {style.timeZone}:</p>
          <p>
            A date and time: <span className="font-mono">{formatDateTime(now, style)}</span> · a date alone:{" "}
            <span className="font-mono">{formatDate(now, style)}</span> · a time alone:{" "}
            <span className="font-mono">{formatTime(now, style)}</span> · a walk of 180 m:{" "}
            <span className="font-mono">{distance(SAMPLE.distanceMm, f.units)}</span>
          </p>
        </div>
      </section>

      <section className="card space-y-4" aria-labelledby="timing-title">
        <h2 id="timing-title">Timing for estimates</h2>
        <p className="max-w-prose text-sm text-ink-soft">
          Every estimate is walking time at the walking speed, plus the time per line for each pick line, plus the
          set-up time once per batch. The defaults (1.0 m/s pushing a cart, 15 s per line, 2 min set-up) are common
          practice, not measured anywhere: replace them with your own time studies.
        </p>
        <div className="grid gap-4 sm:grid-cols-2">
          <RangeField
            label="Walking speed with a cart (m/s"
            name="walkingSpeed"
            decimal
            step="0.05"
            limits={L.walkingSpeedMPerS}
            value={f.walkingSpeed}
            onChange={set("walkingSpeed")}
            note={timingOk && f.units === "imperial" ? speedText(timing.walkingSpeedMmPerS, "imperial") : null}
          />
          <RangeField
            label="Time per pick line (seconds"
            name="secondsPerLine"
            limits={L.secondsPerLine}
            value={f.secondsPerLine}
            onChange={set("secondsPerLine")}
          />
          <RangeField
            label="Set-up time per batch (seconds"
            after=": collecting a cart and totes, dropping them at packing"
            name="setupSeconds"
            limits={L.setupSecondsPerBatch}
            value={f.setupSeconds}
            onChange={set("setupSeconds")}
            note={within(setup, L.setupSecondsPerBatch) && f.setupSeconds.trim() !== "" ? setupText(setup) : null}
          />
          <RangeField
            label="Open batches one picker may hold ("
            name="cap"
            limits={L.maxOpenBatchesPerPicker}
            value={f.cap}
            onChange={set("cap")}
          />
        </div>
        {timingOk && (
          <p className="notice-info" data-testid="estimate-preview">
            A batch with 180 m of walking and 12 lines is estimated at{" "}
            <span className="font-semibold">{minutes(estimateSeconds(SAMPLE, timing))}</span>,{" "}
            {timingNote(timing, f.units)}.
          </p>
        )}
      </section>

      <FailureNotice failure={failure} />
      {saved && (
        <p role="status" className="notice-info">
          {saved}
        </p>
      )}
      <button type="submit" className="btn-primary" disabled={busy}>
        {busy ? "Saving…" : "Save settings"}
      </button>
    </form>
  );
}

/** A number box with its allowed range in the label, and a worked-out reading of it beneath when known. */
function RangeField(props: {
  /** The label up to the range, e.g. "Time per pick line (seconds"; the range and ")" follow. */
  label: string;
  after?: string;
  name: string;
  decimal?: boolean;
  step?: string;
  limits: { min: number; max: number };
  value: string;
  onChange: (e: React.ChangeEvent<HTMLInputElement>) => void;
  note?: string | null;
}) {
  const { min, max } = props.limits;
  const sep = props.label.endsWith("(") ? "" : ", ";
  return (
    <label>
      <span className="label">
        {props.label}
        {sep}
        {min}–{max}){props.after}
      </span>
      <input
        className="field"
        name={props.name}
        type="number"
        inputMode={props.decimal ? "decimal" : "numeric"}
        step={props.step ?? "1"}
        min={min}
        max={max}
        value={props.value}
        onChange={props.onChange}
      />
      {props.note && <span className="mt-1 block text-sm text-ink-soft">= {props.note}</span>}
    </label>
  );
}
