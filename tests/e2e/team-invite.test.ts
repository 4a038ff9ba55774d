import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { waitForMail } from "./helpers/stack";
import { readDemoSignIns, screenshot, signIn, signOut, waitForRenderedAssets } from "./flows";

describe("Team invitation", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
  });
  afterAll(async () => {
    await b?.close();
  });

  it("lets an admin invite an inspector who sets a password from the e-mailed link and signs in", async () => {
    const { page } = b;
    const users = await readDemoSignIns(page, appUrl());
    const email = `inspector.${Date.now()}@larkspur.example`;
    const password = "heron-reach-deck-2026";

    await signIn(page, appUrl(), users.admin.email, users.admin.password);
    await page.waitForURL(`${appUrl()}/`);
    await page.getByRole("link", { name: "Team" }).click();
    await page.waitForURL(`${appUrl()}/team`);
    const form = page.getByTestId("invite-form");
    await form.getByLabel("E-mail").fill(email);
    await form.getByLabel("Role").selectOption("inspector");
    await form.getByRole("button", { name: "Send invitation" }).click();
    await form.getByText(`Invitation sent to ${email}`).waitFor();
    await screenshot(page, "team-admin-invited");

    const mail = await waitForMail((m) => m.to.includes(email), { timeoutMs: 60_000 });
    const link = mail.text.match(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/)?.[0];
    expect(link, "invitation link in the e-mail").toBeDefined();
    expect(link!.startsWith(`${appUrl()}/invite/`)).toBe(true);

    await signOut(page);
    await page.goto(link!);
    const accept = page.getByTestId("accept-invitation-form");
    await accept.getByLabel("Your name").fill("Nadia Okafor");
    await accept.getByLabel("Password", { exact: true }).fill(password);
    await accept.getByLabel("Repeat password").fill(password);
    await screenshot(page, "invite-accept");
    await accept.getByRole("button", { name: "Set password and join" }).click();
    await page.waitForURL(/\/sign-in\?invited=1/);

    await signIn(page, appUrl(), email, password);
    await page.waitForURL(`${appUrl()}/`);
    expect((await page.getByTestId("current-role").innerText()).toLowerCase()).toBe("inspector");
    const count = Number(await page.getByTestId("portfolio-map").getAttribute("data-asset-count"));
    expect(await waitForRenderedAssets(page, count)).toBe(count);

    // The link is single-use.
    await page.goto(link!);
    await page.getByRole("heading", { name: "Invitation not valid" }).waitFor();
  });
});
