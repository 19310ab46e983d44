import { describe, expect, it } from "vitest";
import { shortPickSummaryMail, waveReleasedMail } from "@/lib/mail/wave-mails";

describe("planner mails", () => {
  it("the release mail sums the batches and keeps line breaks out of the subject", () => {
    const m = waveReleasedMail({
      to: "p@x.example",
      name: "Tomasz",
      waveName: "Tue\r\nBcc: evil@x.example",
      batches: [{ number: 1, lineCount: 8, distanceMm: 100_000 }],
      distanceMm: 100_000,
      baselineMm: 110_000,
      link: "http://h/waves/2",
    });
    expect(m.subject).not.toMatch(/[\r\n]/);
    expect(m.subject).toMatch(/\(1 batches\)$/);
    expect(m.text).toContain("Batch 1: 8 lines, 100 m");
    expect(m.text).toContain("9.1 % less");
  });
  it("the summary lists every short line, or says there were none", () => {
    const none = shortPickSummaryMail({ to: "p@x.example", name: "T", waveName: "W", shorts: [], link: "l" });
    expect(none.subject).toBe("Wave picked: W, 0 short picks");
    const one = shortPickSummaryMail({
      to: "p@x.example",
      name: "T",
      waveName: "W",
      shorts: [
        {
          batchNumber: 3,
          orderNumber: "FS-1",
          binCode: "01-002-1",
          sku: "SKU-1",
          ordered: 4,
          picked: 1,
          reason: "damaged",
        },
      ],
      link: "l",
    });
    expect(one.subject).toBe("Wave picked: W, 1 short pick");
    expect(one.text).toContain("Batch 3, order FS-1: SKU-1 at 01-002-1, 1 of 4 (damaged)");
  });
});
