/**
 * The caution of PRODUCT.md as worded for reports (the alert e-mails carry the same points,
 * worded for an alert): shown in the summary, at the end of the annex and in the e-mail.
 */
export const REPORT_CAUTION =
  "This report is an automatic indication computed from vibration measurements; it is not an engineering assessment. "
  + "Natural frequencies and damping also change with temperature, moisture, traffic and faulty sensors, not only with structural change. "
  + "A licensed structural engineer must review it, and the structure must be inspected under the local codes and the owner's procedures, "
  + "before anyone decides on its use, load limits or closure. If the structure shows signs of distress, follow the owner's emergency procedures first.";
