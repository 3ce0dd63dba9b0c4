// The invented staff and subscriber organisations of the demo office (labelled demo everywhere).
import type { Role } from "@/lib/auth/roles";

export const DEMO_OFFICE_NAME = "Halden Ridge Space Weather Desk (demo)";
export const DEMO_CONTACT_LINE = "Halden Ridge duty desk (demo) · desk@halden-ridge.example · +00 555 0100 (invented)";

export const DEMO_ORGANISATIONS = [
  { key: "grid", name: "Northmarch Transmission Cooperative (demo)", sector: "power-grid" },
  { key: "hf", name: "Skylark HF Aviation Radio (demo)", sector: "hf-radio" },
  { key: "sat", name: "Little Auk Satellites (demo)", sector: "satellite-ops" },
] as const;

export interface DemoPerson {
  name: string;
  email: string;
  role: Role;
  password: string;
  organisation?: (typeof DEMO_ORGANISATIONS)[number]["key"];
}

// Passwords of invented demo accounts only; README lists them. Real accounts are invited.
export const DEMO_PEOPLE: DemoPerson[] = [
  { name: "Ines Marlow", email: "ines.marlow@halden-ridge.example", role: "forecaster", password: "sunspot-forecast-1" },
  { name: "Tomas Brenn", email: "tomas.brenn@halden-ridge.example", role: "forecaster", password: "sunspot-forecast-2" },
  { name: "Aurelia Vance", email: "aurelia.vance@halden-ridge.example", role: "duty_officer", password: "duty-desk-sign-1" },
  { name: "Kofi Adjei", email: "kofi.adjei@halden-ridge.example", role: "duty_officer", password: "duty-desk-sign-2" },
  { name: "Priya Lund", email: "priya.lund@halden-ridge.example", role: "verifier", password: "verify-skill-2026" },
  { name: "Sam Okafor", email: "sam.okafor@halden-ridge.example", role: "admin", password: "admin-halden-2026" },
  { name: "Dana Whitlock", email: "dana.whitlock@northmarch.example", role: "subscriber", password: "grid-watch-2026", organisation: "grid" },
  { name: "Rui Castell", email: "rui.castell@skylark-hf.example", role: "subscriber", password: "hf-watch-2026", organisation: "hf" },
  { name: "Mina Sato", email: "mina.sato@little-auk.example", role: "subscriber", password: "sat-watch-2026", organisation: "sat" },
];
