/**
 * The caution of PRODUCT.md in our words, as the Asset Overview shows it beside the
 * condition (the alert pages and e-mails carry lib/email/templates/alert-raised ALERT_CAUTION,
 * worded for an alert; this one speaks of the condition shown on the Overview).
 */
export const OVERVIEW_CAUTION =
  "This condition is an automatic indication computed from vibration measurements; it is not an engineering assessment. "
  + "Natural frequencies and damping also change with temperature, moisture, traffic and faulty sensors, not only with structural change. "
  + "A licensed structural engineer must review it, and the structure must be inspected under the local codes and the owner's procedures, "
  + "before anyone decides on its use, load limits or closure. If the structure shows signs of distress, follow the owner's emergency procedures first.";
