/**
 * The caution of PRODUCT.md in our own words, written once. Alerts, e-mails, reports, the
 * Asset Overview and the serviceability panel each name what they show ("This alert is …",
 * "These comparisons are …"); the rest of the text is the same everywhere.
 */
export type CautionSubject = "alert" | "report" | "condition" | "comparisons";

const OPENING: Record<CautionSubject, { subject: string; is: string; pronoun: string }> = {
  alert: { subject: "This alert", is: "is", pronoun: "it" },
  report: { subject: "This report", is: "is", pronoun: "it" },
  condition: { subject: "This condition", is: "is", pronoun: "it" },
  comparisons: { subject: "These comparisons", is: "are", pronoun: "they" },
};

/** The caution for `subject`, as one paragraph of plain text. */
export function cautionText(subject: CautionSubject): string {
  const o = OPENING[subject];
  return `${o.subject} ${o.is} an automatic indication computed from vibration measurements; ${o.pronoun} ${o.is} not an engineering assessment. `
    + "Natural frequencies and damping also change with temperature, moisture, traffic and faulty sensors, not only with structural change. "
    + `A licensed structural engineer must review ${o.pronoun === "they" ? "them" : "it"}, and the structure must be inspected under the local codes and the owner's procedures, `
    + "before anyone decides on its use, load limits or closure. If the structure shows signs of distress, follow the owner's emergency procedures first.";
}
