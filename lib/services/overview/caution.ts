/**
 * The caution of PRODUCT.md in our words, as the Asset Overview shows it beside the
 * condition (the alert pages and e-mails carry lib/email/templates/alert-raised ALERT_CAUTION,
 * worded for an alert; this one speaks of the condition shown on the Overview).
 */
import { cautionText } from "@/lib/domain/caution";
export const OVERVIEW_CAUTION = cautionText("condition");
