/**
 * What the e2e tests need of the running test stack besides the browser: the app's URL and
 * the mail catcher (re-exported from tests/helpers/mail.ts).
 */
export { appUrl } from "./browser";
export { caughtMails, clearMails, linksIn, waitForMail, type CaughtMail } from "../../helpers/mail";
export { assertTestStack } from "../../helpers/guard";
