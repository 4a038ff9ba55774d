/**
 * The invented Larkspur County demo portfolio: five structures at invented sites in open
 * countryside (no real structure), each with its sensor layout and one gateway. Stable ids
 * make the seed idempotent. Positions are metres in each asset's frame: bridges x along the
 * span from the west abutment, y across, z up; towers z up from the base, x east, y north.
 */
import type { AssetCondition, AssetKind, ChannelDirection, PositionM } from "../../../lib/domain/types";

const id = (group: string, n: number) => `6c1a0000-0000-4000-8000-${group}${String(n).padStart(12 - group.length, "0")}`;

export interface DemoChannel { id: string; code: string; positionM: PositionM; direction: ChannelDirection }
export interface DemoAsset {
  id: string;
  name: string;
  kind: AssetKind;
  latitude: number;
  longitude: number;
  material: string;
  mainDimensionM: number;
  /** The demo history has a record every 6 h: an asset reads silent after two missed slots. */
  expectedIntervalMin: number;
  condition: AssetCondition;
  channels: DemoChannel[];
  gateway: { id: string; name: string; slug: string };
}

type Ch = [code: string, x: number, y: number, z: number, direction: ChannelDirection];

function channels(assetNo: number, list: Ch[]): DemoChannel[] {
  return list.map(([code, x, y, z, direction], i) => ({
    id: id(`00000003${assetNo}`, i + 1), code, positionM: { x, y, z }, direction,
  }));
}

export const DEMO_ASSETS: readonly DemoAsset[] = [
  {
    id: id("0000000002", 1), name: "Millrace Footbridge", kind: "footbridge",
    latitude: 39.0712, longitude: -103.9843, material: "Steel truss", mainDimensionM: 42,
    expectedIntervalMin: 720, condition: "steady",
    channels: channels(1, [
      ["A1", 10.5, -1.2, 0, "z"], ["A2", 10.5, 1.2, 0, "z"], ["A3", 21, -1.2, 0, "z"],
      ["A4", 21, 1.2, 0, "z"], ["A5", 21, 0, 0, "y"], ["A6", 31.5, 0, 0, "z"],
    ]),
    gateway: { id: id("0000000004", 1), name: "Millrace east abutment gateway", slug: "millrace" },
  },
  {
    id: id("0000000002", 2), name: "Fernbrook Timber Footbridge", kind: "footbridge",
    latitude: 39.1127, longitude: -104.0418, material: "Glued-laminated timber", mainDimensionM: 28,
    expectedIntervalMin: 720, condition: "steady",
    channels: channels(2, [["A1", 7, 0, 0, "z"], ["A2", 14, 0, 0, "z"], ["A3", 14, 0, 0, "y"], ["A4", 21, 0, 0, "z"]]),
    gateway: { id: id("0000000004", 2), name: "Fernbrook cabinet gateway", slug: "fernbrook" },
  },
  {
    id: id("0000000002", 3), name: "Heron Reach Cable-Stayed Footbridge", kind: "pedestrian_bridge",
    latitude: 39.0365, longitude: -103.9127, material: "Steel deck, steel pylon, locked-coil stays", mainDimensionM: 65,
    expectedIntervalMin: 720, condition: "alert",
    channels: channels(3, [
      ["A1", 16.25, -1.5, 0, "z"], ["A2", 16.25, 1.5, 0, "z"], ["A3", 32.5, -1.5, 0, "z"], ["A4", 32.5, 1.5, 0, "z"],
      ["A5", 32.5, 0, 0, "y"], ["A6", 48.75, -1.5, 0, "z"], ["A7", 48.75, 1.5, 0, "z"], ["A8", 48.75, 0, 0, "y"],
    ]),
    gateway: { id: id("0000000004", 3), name: "Heron Reach pylon gateway", slug: "heron-reach" },
  },
  {
    id: id("0000000002", 4), name: "Carrow Hill Telecom Mast", kind: "mast",
    latitude: 39.1541, longitude: -103.9562, material: "Galvanised steel lattice", mainDimensionM: 60,
    expectedIntervalMin: 720, condition: "watch",
    channels: channels(4, [
      ["A1", 0, 0, 30, "x"], ["A2", 0, 0, 30, "y"], ["A3", 0, 0, 45, "x"],
      ["A4", 0, 0, 45, "y"], ["A5", 0, 0, 60, "x"], ["A6", 0, 0, 60, "y"],
    ]),
    gateway: { id: id("0000000004", 4), name: "Carrow Hill equipment hut gateway", slug: "carrow-hill" },
  },
  {
    id: id("0000000002", 5), name: "Quarry Lane Lighting Tower", kind: "tower",
    latitude: 39.0938, longitude: -103.8816, material: "Steel tube", mainDimensionM: 35,
    expectedIntervalMin: 720, condition: "steady",
    channels: channels(5, [["A1", 0, 0, 17.5, "x"], ["A2", 0, 0, 17.5, "y"], ["A3", 0, 0, 35, "x"], ["A4", 0, 0, 35, "y"]]),
    gateway: { id: id("0000000004", 5), name: "Quarry Lane base gateway", slug: "quarry-lane" },
  },
];

/** Stable user ids of the demo sign-ins, by role. */
export const DEMO_USER_IDS = {
  admin: id("0000000001", 1),
  engineer: id("0000000001", 2),
  inspector: id("0000000001", 3),
  owner: id("0000000001", 4),
} as const;
