/**
 * Alerts in the browser on a phone (390×844): the demo inspector opens Heron Reach's open
 * alert from the inbox (PRODUCT.md demo: one footbridge with a stiffness loss has an open
 * alert), reads the caution, acknowledges, schedules the inspection, attaches a photo (shown
 * as a thumbnail served by the attachments route), and closes with an outcome. The asset's
 * condition then follows: PRODUCT.md `alert` is "confirmed drift, inspection asked", so with
 * the inspection done and the drift still beyond its limits the asset shows `watch`.
 * Afterwards the demo is put back as seeded (see the file's afterAll).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { closeQueues } from "@/lib/jobs/queues";
import { recomputeDrift } from "@/lib/services/drift/drift.service";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { fetchAssetsInPage, readDemoSignIns, screenshot, signIn, signInAsDemo } from "./flows";

const PHONE = { width: 390, height: 844 };
const HERON = "Heron Reach Cable-Stayed Footbridge";
// A 1×1 PNG (signature, IHDR, IDAT, IEND; RFC 2083).
const PHOTO = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");

/** Tomorrow as YYYY-MM-DD in the organisation's zone is at most a day off the browser's; two days ahead is safely in the future. */
function dayAhead(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

// Set by the phone test when it closed the demo alert; used to put the demo back afterwards.
let closed: { alertId: string; assetId: string } | null = null;

afterAll(async () => {
  await closeQueues();
  await closeDb();
});

describe("Alerts on a phone", () => {
  let b: BrowserSession;
  let inspector: { email: string; password: string };

  beforeAll(async () => {
    const first = await openBrowser();
    try {
      inspector = (await readDemoSignIns(first.page, appUrl())).inspector;
    } finally {
      await first.close();
    }
    b = await openBrowser({ viewport: PHONE });
    await signIn(b.page, appUrl(), inspector.email, inspector.password);
    await b.page.waitForURL(`${appUrl()}/`);
  });
  afterAll(async () => {
    await b?.close();
  });

  it("lists Heron Reach's open alert first in the inbox, without horizontal scrolling", async () => {
    const { page } = b;
    expect(inspector.email).toBe("inspector@larkspur.example");
    await page.goto(`${appUrl()}/alerts`);
    const rows = page.locator("[data-alert-row]");
    await rows.first().waitFor();
    expect(await rows.first().getAttribute("data-alert-asset")).toBe(HERON);
    expect(await rows.first().getAttribute("data-state")).toBe("open");
    // The inbox itself fits the phone's width (the shared header is the layout's business).
    const overflow = await page.locator("main").evaluate((m) => Math.max(m.scrollWidth - m.clientWidth, m.getBoundingClientRect().right - window.innerWidth));
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "alerts-inbox-phone");
    // The state filter narrows the list through the URL.
    await page.getByLabel("State").selectOption("closed");
    await page.getByRole("button", { name: "Apply" }).click();
    await page.waitForURL(/state=closed/);
    expect(await page.locator(`[data-alert-row][data-state="open"]`).count()).toBe(0);
  });

  it("acknowledges, schedules, attaches a photo and closes with an outcome; the asset leaves `alert`", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/alerts?state=open`);
    const row = page.locator(`[data-alert-row][data-alert-asset="${HERON}"]`).first();
    await row.getByRole("link").click();
    await page.waitForURL(/\/alerts\/[0-9a-f-]{36}$/);
    const alertId = page.url().split("/").pop() ?? "";
    await expect.poll(() => page.getByTestId("alert-caution").innerText()).toMatch(/not an engineering assessment/);
    expect(await page.locator("[data-evidence-mode]").count()).toBeGreaterThan(0);
    const detailOverflow = await page.locator("main").evaluate((m) => m.scrollWidth - m.clientWidth);
    expect(detailOverflow).toBeLessThanOrEqual(0);
    const status = page.getByTestId("alert-status");

    await page.getByRole("button", { name: "Acknowledge" }).click();
    await status.locator('[data-alert-state="acknowledged"]').waitFor();

    await page.getByLabel("Inspection date").fill(dayAhead(2));
    await page.getByRole("button", { name: "Schedule inspection" }).click();
    await status.locator('[data-alert-state="inspection_scheduled"]').waitFor();

    await page.getByLabel("Photo or PDF").setInputFiles({ name: "east-anchorage.png", mimeType: "image/png", buffer: PHOTO });
    await page.getByRole("button", { name: "Attach" }).click();
    const thumb = page.locator('[data-attachment="east-anchorage.png"] img');
    await thumb.waitFor();
    // The thumbnail is really decoded from the attachments route (not a broken image).
    await expect.poll(() => thumb.evaluate((img) => (img as HTMLImageElement).complete && (img as HTMLImageElement).naturalWidth)).toBe(1);
    await screenshot(page, "alert-detail-phone");

    await page.getByLabel("Outcome").selectOption("no_defect_found");
    await page.getByLabel("Findings").fill("Stay cables, anchorages and bearings inspected; no defect found.");
    await page.getByRole("button", { name: "Close alert" }).click();
    await status.locator('[data-alert-state="closed"]').waitFor();
    expect(await page.getByTestId("alert-outcome").innerText()).toBe("No defect found");
    const kinds = await page.locator("[data-event-kind]").evaluateAll((els) => els.map((e) => e.getAttribute("data-event-kind")));
    expect(kinds).toEqual(expect.arrayContaining(["raised", "acknowledged", "inspection_scheduled", "attachment", "closed"]));
    expect(await page.getByRole("button", { name: "Close alert" }).count()).toBe(0);

    // The drift replay queued by the closure sets the condition (worker of the e2e stage).
    let heron: { id: string; condition: string } | undefined;
    for (let i = 0; i < 60; i++) {
      heron = (await fetchAssetsInPage(page)).find((a) => a.name === HERON);
      if (heron && heron.condition !== "alert") break;
      await page.waitForTimeout(1000);
    }
    closed = heron ? { alertId, assetId: heron.id } : null;
    expect(heron?.condition).toBe("watch");
    await page.goto(`${appUrl()}/assets/${heron?.id}`);
    await page.locator('[data-condition="watch"]').first().waitFor();
    expect(await page.locator('[data-condition="alert"]').count()).toBe(0);
    await page.goto(`${appUrl()}/alerts/${alertId}`);
    await screenshot(page, "alert-closed-phone");
  });

  it("mutes an asset's alert e-mails from the Account page", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/account`);
    const form = page.getByTestId("notification-form");
    const box = form.getByRole("checkbox", { name: HERON });
    expect(await box.isChecked()).toBe(false);
    await box.check();
    await form.getByRole("button", { name: "Save e-mail settings" }).click();
    await form.getByText("Saved.").waitFor();
    await page.reload();
    const again = page.getByTestId("notification-form");
    expect(await again.getByRole("checkbox", { name: HERON }).isChecked()).toBe(true);
    // Leave the demo inspector's e-mails as seeded.
    await again.getByRole("checkbox", { name: HERON }).uncheck();
    await again.getByRole("button", { name: "Save e-mail settings" }).click();
    await again.getByText("Saved.").waitFor();
  });
});

describe("Alerts for an owner on a desktop", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
    await signInAsDemo(b.page, appUrl(), "owner");
  });
  afterAll(async () => {
    await b?.close();
  });

  it("shows the closed alert with its evidence, photo and history, and no control to change it", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/alerts?state=closed`);
    await page.locator(`[data-alert-row][data-alert-asset="${HERON}"]`).first().getByRole("link").click();
    await page.waitForURL(/\/alerts\/[0-9a-f-]{36}$/);
    await page.getByTestId("alert-caution").waitFor();
    await page.locator('[data-attachment="east-anchorage.png"] img').waitFor();
    for (const name of ["Acknowledge", "Schedule inspection", "Assign", "Attach", "Add comment", "Close alert"]) {
      expect(await page.getByRole("button", { name, exact: true }).count()).toBe(0);
    }
    await screenshot(page, "alert-closed-owner-desktop");
    await page.goto(`${appUrl()}/alerts`);
    await screenshot(page, "alerts-inbox-desktop");
  });
});

/**
 * An engineer closes an alert as `repaired`: the alert page then offers to start a new
 * baseline (a repair changes the frequencies the old baseline predicts) and the link opens
 * the asset's Baselines screen. The alert is made for this test on a steady demo asset, with
 * the evidence snapshot of the demo's Heron Reach alert, and removed afterwards.
 */
describe("An alert closed as repaired", () => {
  const STEADY = "Millrace Footbridge";
  let b: BrowserSession;
  let made: { alertId: string; assetId: string } | null = null;
  beforeAll(async () => {
    const asset = await db()("assets").where({ name: STEADY }).first("id");
    const heron = await db()("alerts as al").join("assets as a", "a.id", "al.asset_id").where("a.name", HERON).orderBy("al.raised_at", "desc").first("al.evidence");
    const [row] = await db()("alerts").insert({ asset_id: asset.id, raised_at: new Date(), evidence: JSON.stringify(heron.evidence), state: "open" }).returning("id");
    made = { alertId: row.id, assetId: asset.id };
    await db()("alert_events").insert({ alert_id: row.id, actor_user_id: null, kind: "raised", details: "{}" });
    b = await openBrowser();
    await signInAsDemo(b.page, appUrl(), "engineer");
  });
  afterAll(async () => {
    await b?.close();
    if (made) await db()("alerts").where({ id: made.alertId }).delete();
    if (made) await recomputeDrift(made.assetId);
  });

  it("offers to start a new baseline, which opens the asset's Baselines screen", async () => {
    const { page } = b;
    await page.goto(`${appUrl()}/alerts/${made?.alertId}`);
    expect(await page.getByRole("link", { name: "Start a new baseline" }).count()).toBe(0);
    await page.getByLabel("Outcome").selectOption("repaired");
    await page.getByLabel("Findings").fill("Loose bolts at the east bearing re-torqued; deck drainage cleared.");
    await page.getByRole("button", { name: "Close alert" }).click();
    await page.getByTestId("alert-status").locator('[data-alert-state="closed"]').waitFor();
    const link = page.getByRole("link", { name: "Start a new baseline" });
    await link.waitFor();
    await screenshot(page, "alert-repaired-engineer");
    await link.click();
    await page.waitForURL(`${appUrl()}/assets/${made?.assetId}/baselines`);
    await page.getByRole("form", { name: "Fit a new baseline" }).waitFor();
  });
});

/**
 * Later e2e files (Overview, Reports) read the demo as seeded: Heron Reach with an open alert.
 * Remove the alert closed above and replay the asset's drift through the real service, which
 * raises it again at the same time from the same statistics and sets `alert` back.
 */
describe("after the alert tests", () => {
  it("puts the demo back as seeded: Heron Reach with an open alert", async () => {
    expect(closed).not.toBeNull(); // set when the phone test closed the alert
    const { alertId, assetId } = closed ?? { alertId: "", assetId: "" };
    await db()("alerts").where({ id: alertId, state: "closed" }).delete();
    const outcome = await recomputeDrift(assetId);
    expect(outcome.raisedAlertIds).toHaveLength(1);
    expect(outcome.condition).toBe("alert");
    const live = await db()("alerts").where({ asset_id: assetId }).whereNot({ state: "closed" }).select("id");
    expect(live).toHaveLength(1);
  });
});
