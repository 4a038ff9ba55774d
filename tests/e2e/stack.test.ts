import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeQueues, enqueueMail } from "@/lib/jobs/queues";
import { openBrowser, type BrowserSession } from "./helpers/browser";
import { appUrl, assertTestStack, clearMails, waitForMail } from "./helpers/stack";

// The running stack of issue 2: the built app answers /api/health with db and redis ok, and a
// message put on the `mail` queue is sent by the worker process to the catcher and listed on
// /dev/mail (the page for humans, shown only when MODEWARDEN_DEV_MAIL=1).

let browser: BrowserSession;
beforeAll(async () => {
  assertTestStack();
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeQueues();
});

describe("the running stack", () => {
  it("answers GET /api/health with 200, db ok and redis ok, without a session", async () => {
    const res = await fetch(`${appUrl()}/api/health`);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ db: "ok", redis: "ok" });
  });

  it("delivers a queued e-mail through the worker to the catcher and lists it on /dev/mail", async () => {
    await clearMails();
    const subject = `Stack check ${Date.now().toString(36)}`;
    await enqueueMail({ to: "stack-check@larkspur.example", subject, text: `Follow ${appUrl()}/sign-in to continue.` });
    const mail = await waitForMail((m) => m.subject === subject);
    expect(mail.to).toEqual(["stack-check@larkspur.example"]);

    const { page } = browser;
    await page.goto("/dev/mail");
    const item = page.getByTestId("caught-mail").filter({ hasText: subject });
    await expect(item.count()).resolves.toBe(1);
    await expect(item.getByRole("link", { name: `${appUrl()}/sign-in` }).getAttribute("href")).resolves.toBe(`${appUrl()}/sign-in`);
  });
});
