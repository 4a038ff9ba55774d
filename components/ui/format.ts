/** Date and number formatting shared by pages; times are shown in the organisation's zone. */
export function formatDateTime(iso: string | Date | null, timeZone?: string): string {
  if (!iso) return "—";
  const d = typeof iso === "string" ? new Date(iso) : iso;
  return new Intl.DateTimeFormat("en-GB", {
    timeZone,
    year: "numeric",
    month: "short",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
  }).format(d);
}

export function formatDate(iso: string | Date | null, timeZone?: string): string {
  if (!iso) return "—";
  const d = typeof iso === "string" ? new Date(iso) : iso;
  return new Intl.DateTimeFormat("en-GB", { timeZone, year: "numeric", month: "short", day: "2-digit" }).format(d);
}

export function formatCoord(lat: number, lon: number): string {
  const ns = lat >= 0 ? "N" : "S";
  const ew = lon >= 0 ? "E" : "W";
  return `${Math.abs(lat).toFixed(4)}° ${ns}, ${Math.abs(lon).toFixed(4)}° ${ew}`;
}

export const KIND_LABELS: Record<string, string> = {
  footbridge: "Footbridge",
  pedestrian_bridge: "Pedestrian bridge",
  tower: "Tower",
  mast: "Mast",
  chimney: "Chimney",
  other: "Other",
};

export const ROLE_LABELS: Record<string, string> = {
  admin: "Admin",
  engineer: "Engineer",
  inspector: "Inspector",
  owner: "Owner",
};
