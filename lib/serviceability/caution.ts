/**
 * The caution of PRODUCT.md, worded for the serviceability panel, and the note that a
 * comparison of measured ambient responses with code values is no code verification.
 */
export const SERVICEABILITY_CAUTION =
  "These comparisons are an automatic indication computed from vibration measurements; they are not an engineering assessment. "
  + "Natural frequencies and damping also change with temperature, moisture, traffic and faulty sensors, not only with structural change. "
  + "A licensed structural engineer must review them, and the structure must be inspected under the local codes and the owner's procedures, "
  + "before anyone decides on its use, load limits or closure. If the structure shows signs of distress, follow the owner's emergency procedures first.";

export const NOT_CODE_VERIFICATION =
  "Measured responses come from the loads that happened to act (ambient traffic, wind); they are not the design load cases of the code. "
  + "Setting them against code and guidance values is no code verification. National annexes may set other values.";
