import { describe, expect, it } from "vitest";
import { ChannelInput, CreateAssetInput, UpdateAssetInput } from "@/lib/services/assets/schemas";
import { AcceptInvitationInput, InviteMemberInput } from "@/lib/services/team/schemas";

const formAsset = { name: " Test Bridge ", kind: "footbridge", latitude: "39.5", longitude: "-104.25", material: "", mainDimensionM: "", expectedIntervalMin: "30" };

describe("CreateAssetInput", () => {
  it("accepts form text, trims names and turns empty optional fields into null", () => {
    const v = CreateAssetInput.parse(formAsset);
    expect(v).toEqual({
      name: "Test Bridge", kind: "footbridge", latitude: 39.5, longitude: -104.25, material: null, mainDimensionM: null,
      expectedIntervalMin: 30,
    });
  });

  it("reports every invalid field at once (WGS84 latitude within ±90°, longitude within ±180°)", () => {
    const r = CreateAssetInput.safeParse({ ...formAsset, name: "", latitude: "91", longitude: "east", kind: "bridge" });
    expect(r.success).toBe(false);
    if (r.success) return;
    const fields = new Set(r.error.issues.map((i) => i.path.join(".")));
    expect(fields).toEqual(new Set(["name", "latitude", "longitude", "kind"]));
  });

  it("refuses a missing latitude with a 'required' message and a non-positive span", () => {
    const r = CreateAssetInput.safeParse({ ...formAsset, latitude: "", mainDimensionM: "0" });
    expect(r.success).toBe(false);
    if (r.success) return;
    expect(r.error.issues.find((i) => i.path[0] === "latitude")?.message).toMatch(/required/);
    expect(r.error.issues.some((i) => i.path[0] === "mainDimensionM")).toBe(true);
  });
});

describe("UpdateAssetInput", () => {
  it("leaves absent fields out (unchanged) and keeps an explicit null (cleared)", () => {
    expect(UpdateAssetInput.parse({ material: null })).toEqual({ material: null });
    expect(UpdateAssetInput.parse({})).toEqual({});
  });
});

describe("ChannelInput", () => {
  it("accepts the codes gateways use and refuses spaces or an empty code", () => {
    expect(ChannelInput.parse({ code: "A1", positionM: { x: 0, y: 0, z: 0 }, direction: "-z" }).direction).toBe("-z");
    for (const code of ["", "A 1", "-A1", "x".repeat(33)]) {
      expect(ChannelInput.safeParse({ code, positionM: { x: 0, y: 0, z: 0 }, direction: "z" }).success).toBe(false);
    }
  });

  it("refuses a direction outside x, y, z, -x, -y, -z (issue 2 item 4)", () => {
    expect(ChannelInput.safeParse({ code: "A1", positionM: { x: 0, y: 0, z: 0 }, direction: "xy" }).success).toBe(false);
  });
});

describe("passwords and invitations", () => {
  it("needs at least 12 characters (issue 2 item 5)", () => {
    const base = { token: "t", displayName: "New Inspector" };
    expect(AcceptInvitationInput.safeParse({ ...base, password: "a".repeat(11) }).success).toBe(false);
    expect(AcceptInvitationInput.safeParse({ ...base, password: "a".repeat(12) }).success).toBe(true);
  });

  it("lower-cases invited e-mail addresses and refuses roles outside the table", () => {
    expect(InviteMemberInput.parse({ email: " New.Person@Example.COM ", role: "inspector" }).email).toBe("new.person@example.com");
    expect(InviteMemberInput.safeParse({ email: "x@example.com", role: "gateway" }).success).toBe(false);
  });
});
