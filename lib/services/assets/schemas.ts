import { z } from "zod";
import { ASSET_KINDS, CHANNEL_DIRECTIONS, CHANNEL_QUANTITIES } from "@/lib/domain/types";
import { booleanField, nullableNumberField, nullableTextField, numberField } from "@/lib/services/fields";

const name = z.string({ error: "Name is required." }).trim().min(1, "Name is required.").max(120, "At most 120 characters.");
const kind = z.enum(ASSET_KINDS, { error: "Choose a kind." });
const latitude = numberField("Latitude").pipe(z.number().min(-90, "Latitude must be ≥ -90.").max(90, "Latitude must be ≤ 90."));
const longitude = numberField("Longitude").pipe(
  z.number().min(-180, "Longitude must be ≥ -180.").max(180, "Longitude must be ≤ 180."),
);
const mainDimensionM = nullableNumberField("Main span or height").pipe(
  z.number().positive("Must be greater than 0 m.").max(5000, "At most 5000 m.").nullable(),
);
const expectedIntervalMin = numberField("Expected record interval").pipe(
  z.number().int("Whole minutes.").min(1, "At least 1 minute.").max(10080, "At most one week (10080 minutes)."),
);

/** Create an asset (condition starts as `commissioning`; the pipeline sets it later). */
export const CreateAssetInput = z.object({
  name,
  kind,
  latitude,
  longitude,
  material: nullableTextField(80).optional(),
  mainDimensionM: mainDimensionM.optional(),
  expectedIntervalMin: expectedIntervalMin.optional(),
});
export type CreateAssetInput = z.infer<typeof CreateAssetInput>;

/** Edit an asset: any subset of the create fields; absent = unchanged, empty optional = cleared. */
export const UpdateAssetInput = z.object({
  name: name.optional(),
  kind: kind.optional(),
  latitude: latitude.optional(),
  longitude: longitude.optional(),
  material: nullableTextField(80).optional(),
  mainDimensionM: mainDimensionM.optional(),
  expectedIntervalMin: expectedIntervalMin.optional(),
});
export type UpdateAssetInput = z.infer<typeof UpdateAssetInput>;

const code = z
  .string({ error: "Code is required." })
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,31}$/, "1–32 letters, digits, '_', '.' or '-', starting with a letter or digit.");
const coordinate = (axis: string) => numberField(`Position ${axis}`).pipe(
  z.number().min(-10000, "Within ±10 km of the origin.").max(10000, "Within ±10 km of the origin."),
);
const positionM = z.object({ x: coordinate("x"), y: coordinate("y"), z: coordinate("z") });
const direction = z.enum(CHANNEL_DIRECTIONS, { error: "Choose a direction: x, y, z, -x, -y or -z." });
const quantity = z.enum(CHANNEL_QUANTITIES, { error: "Choose acceleration or force." });
const units = z.string().trim().min(1, "Units are required.").max(16, "At most 16 characters.");
const sensitivity = nullableNumberField("Sensitivity").pipe(z.number().positive("Must be greater than 0.").nullable());

/** Add a sensor channel. Units default to m/s2 (acceleration) or N (force). */
export const ChannelInput = z.object({
  code,
  positionM,
  direction,
  quantity: quantity.optional(),
  units: units.optional(),
  sensitivity: sensitivity.optional(),
  active: booleanField.optional(),
});
export type ChannelInput = z.infer<typeof ChannelInput>;

/** Edit a sensor channel: any subset of its fields. */
export const UpdateChannelInput = z.object({
  code: code.optional(),
  positionM: positionM.optional(),
  direction: direction.optional(),
  quantity: quantity.optional(),
  units: units.optional(),
  sensitivity: sensitivity.optional(),
  active: booleanField.optional(),
});
export type UpdateChannelInput = z.infer<typeof UpdateChannelInput>;

export const CreateGatewayInput = z.object({
  name: z.string({ error: "Name is required." }).trim().min(1, "Name is required.").max(80, "At most 80 characters."),
});
export type CreateGatewayInput = z.infer<typeof CreateGatewayInput>;
