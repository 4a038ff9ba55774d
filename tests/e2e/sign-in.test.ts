import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, openBrowser, type BrowserSession } from "./helpers/browser";
import { readDemoSignIns, screenshot, signIn } from "./flows";

describe("Sign-in page", () => {
  let b: BrowserSession;
  beforeAll(async () => {
    b = await openBrowser();
  });
  afterAll(async () => {
    await b?.close();
  });

  it("sends a signed-out visitor of the Portfolio to sign-in", async () => {
    await b.page.goto(`${appUrl()}/`);
    await b.page.waitForURL(/\/sign-in/);
    expect(await b.page.getByRole("heading", { name: "Sign in" }).isVisible()).toBe(true);
  });

  it("shows an error and stays on the page after a wrong password", async () => {
    const { page } = b;
    const users = await readDemoSignIns(page, appUrl());
    await signIn(page, appUrl(), users.engineer.email, `${users.engineer.password}-wrong`);
    // Inside the form: Next's route announcer is also role="alert".
    const error = page.locator("form [role=alert]");
    await error.waitFor();
    expect(await error.innerText()).toMatch(/e-mail or password is not right/i);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await screenshot(page, "sign-in-wrong-password");
  });
});
