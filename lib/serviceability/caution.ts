/**
 * The caution of PRODUCT.md, worded for the serviceability panel, and the note that a
 * comparison of measured ambient responses with code values is no code verification.
 */
import { cautionText } from "@/lib/domain/caution";
export const SERVICEABILITY_CAUTION = cautionText("comparisons");

export const NOT_CODE_VERIFICATION =
  "Measured responses come from the loads that happened to act (ambient traffic, wind); they are not the design load cases of the code. "
  + "Setting them against code and guidance values is no code verification. National annexes may set other values.";
