/**
 * The caution of PRODUCT.md as worded for reports (the alert e-mails carry the same points,
 * worded for an alert): shown in the summary, at the end of the annex and in the e-mail.
 */
import { cautionText } from "@/lib/domain/caution";
export const REPORT_CAUTION = cautionText("report");
