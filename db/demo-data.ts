import type { LabRole } from "@/lib/contracts/roles";
import { materialCopy } from "@/lib/materials/copy";
import { materialById } from "@/lib/materials/library";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { ModelParams } from "@/lib/physics/schema";

/*
 * The invented demo world seeded by db/seed.ts. Every lab, person and sample here is made up.
 * Fixed ids make the seed idempotent (insert … on conflict do nothing) and give browser tests
 * stable links. No "server-only" marker: the seed script runs under plain Node.
 */

export const DEMO_PASSWORD = "gyrolux-demo";

export const DEMO_LAB = {
  id: "6a1f0c2e-5b1d-4c1e-9f00-00000000a001",
  name: "Lindqvist Moor Faraday Laboratory",
} as const;

export const OTHER_LAB = {
  id: "6a1f0c2e-5b1d-4c1e-9f00-00000000a002",
  name: "Blackfen Optics Lab",
} as const;

/** The demo lab's terbium gallium garnet set, the one tests and links open. */
export const DEMO_GARNET_SET_ID = "6a1f0c2e-5b1d-4c1e-9f00-00000000c001";
/** The demo lab's borate glass set (the generated glass measurements are drawn from it). */
export const DEMO_GLASS_SET_ID = "6a1f0c2e-5b1d-4c1e-9f00-00000000c002";
/** The other lab's set, which members of the demo lab must not see. */
export const OTHER_LAB_SET_ID = "6a1f0c2e-5b1d-4c1e-9f00-00000000c005";

export interface DemoUser {
  id: string;
  email: string;
  name: string;
  siteRole: "admin" | "member";
  memberships: { labId: string; role: LabRole }[];
}

export const DEMO_USERS = {
  lead: {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000b001",
    email: "lead@demo.gyrolux.test",
    name: "Dr. Oriane Castellanos-Whitby",
    siteRole: "member",
    memberships: [{ labId: DEMO_LAB.id, role: "owner" }],
  },
  postdoc: {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000b002",
    email: "postdoc@demo.gyrolux.test",
    name: "Dr. Tomasz Elbrecht",
    siteRole: "member",
    memberships: [{ labId: DEMO_LAB.id, role: "editor" }],
  },
  student: {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000b003",
    email: "student@demo.gyrolux.test",
    name: "Priya Anand-Lowe",
    siteRole: "member",
    memberships: [{ labId: DEMO_LAB.id, role: "viewer" }],
  },
  outsider: {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000b004",
    email: "outsider@demo.gyrolux.test",
    name: "Dr. Kofi Mensah-Rudd",
    siteRole: "member",
    memberships: [{ labId: OTHER_LAB.id, role: "owner" }],
  },
  admin: {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000b005",
    email: "admin@demo.gyrolux.test",
    name: "Site Administrator (demo)",
    siteRole: "admin",
    memberships: [],
  },
} as const satisfies Record<string, DemoUser>;

export interface DemoVersion {
  /** Who saved this version. */
  by: keyof typeof DEMO_USERS;
  /** How many days before the seed the version was saved (history shows a plausible timeline). */
  daysAgo: number;
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
  /** Where the version came from when not typed in (a library material). */
  provenance?: Record<string, unknown>;
}

export interface DemoSet {
  id: string;
  labId: string;
  /** Oldest first; the last one is the set's current state. */
  versions: DemoVersion[];
}

const INVENTED = "Invented demo data, not a measurement.";

/*
 * The garnet sets switch on the bound-electron (diamagnetic) term of physics-model §5.5. On its own
 * it adds about +21 rad/(T·m) at 632.8 nm to this garnet, so κE is recalibrated (here, by a
 * bisection on the engine) to 6.218e-3 /T to keep V(632.8 nm, 293.15 K, 1 T) = −134.0 rad/(T·m);
 * V(1064 nm) is then −39.1. Descriptions and tags say so.
 */
const WITH_DIAMAGNETIC = { diamagneticTerm: true, gyrationPerT: 6.218e-3 } as const;
const DIAMAGNETIC_NOTE = "Diamagnetic (bound-electron) term on; κE recalibrated to 6.218e-3 /T so that V(632.8 nm) stays −134 rad/(T·m).";

const borateGlass: ModelParams = {
  ionDensityPerM3: 5e27,
  landeG: 1.5,
  totalJ: 6,
  curieWeissK: -2,
  gilbertDamping: 0.01,
  magneticScale: 1,
  epsInf: 1,
  sellmeierB: 1.5,
  sellmeierWavelengthNm: 110,
  oscillatorStrength: 0.01,
  oscillatorWavelengthNm: 240,
  oscillatorDampingRadPerS: 1e14,
  gyrationPerT: 3e-3,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.02,
};

// Dy³⁺ (⁶H₁₅/₂): g = 4/3, J = 15/2 (Hund's rules); the optical figures are invented.
const dysprosiumGarnet: ModelParams = {
  ...TERBIUM_GARNET_DEFAULTS,
  ionDensityPerM3: 1.26e28,
  landeG: 4 / 3,
  totalJ: 7.5,
  curieWeissK: -3,
  sellmeierB: 2.65,
  sellmeierWavelengthNm: 132,
  oscillatorStrength: 0.012,
  oscillatorWavelengthNm: 245,
  gyrationPerT: 3.1e-3,
  diamagneticTerm: true,
};

// Ce³⁺ (²F₅/₂): g = 6/7, J = 5/2; the optical figures are invented.
const ceriumGlass: ModelParams = {
  ...borateGlass,
  ionDensityPerM3: 3e27,
  landeG: 6 / 7,
  totalJ: 2.5,
  curieWeissK: -1,
  oscillatorWavelengthNm: 310,
  gyrationPerT: 2e-3,
};

/** The terbium garnet as the material library gives it, saved today by the lead with its provenance. */
function libraryGarnetVersion(): DemoVersion {
  const copy = materialCopy(materialById("tgg")!, "Terbium gallium garnet — handbook values");
  return {
    by: "lead",
    daysAgo: 0,
    name: copy.name,
    description: copy.description,
    tags: ["TGG", "reference", "room-temperature", ...copy.tags],
    params: copy.params,
    provenance: { ...copy.provenance },
  };
}

export const DEMO_SETS: DemoSet[] = [
  {
    id: DEMO_GARNET_SET_ID,
    labId: DEMO_LAB.id,
    versions: [
      {
        by: "lead",
        daysAgo: 21,
        name: "Terbium gallium garnet — handbook values",
        description: `Handbook figures for TGG at room temperature, 1 T, 20 mm rod. ${INVENTED}`,
        tags: ["TGG", "reference"],
        params: { ...TERBIUM_GARNET_DEFAULTS, lengthM: 0.02 },
      },
      {
        by: "postdoc",
        daysAgo: 14,
        name: "Terbium gallium garnet — handbook values",
        description: `Handbook figures for TGG at room temperature, 1 T, 10 mm crystal (the rod we actually mount). ${INVENTED}`,
        tags: ["TGG", "reference", "room-temperature"],
        params: { ...TERBIUM_GARNET_DEFAULTS },
      },
      {
        by: "lead",
        daysAgo: 1,
        name: "Terbium gallium garnet — handbook values",
        description: `Handbook figures for TGG at room temperature, 1 T, 10 mm crystal. ${DIAMAGNETIC_NOTE} ${INVENTED}`,
        tags: ["TGG", "reference", "room-temperature", "diamagnetic term"],
        params: { ...TERBIUM_GARNET_DEFAULTS, ...WITH_DIAMAGNETIC },
      },
      // The handbook set now comes from the material library: cited index, measured loss, fitted κE.
      libraryGarnetVersion(),
    ],
  },
  {
    id: DEMO_GLASS_SET_ID,
    labId: DEMO_LAB.id,
    versions: [
      {
        by: "postdoc",
        daysAgo: 12,
        name: "Tb-doped borate glass — sample LM-B7",
        description: `Terbium-doped borate glass, first guess before the fit. ${INVENTED}`,
        tags: ["glass", "Tb"],
        params: { ...borateGlass, gyrationPerT: 2.5e-3 },
      },
      {
        by: "postdoc",
        daysAgo: 9,
        name: "Tb-doped borate glass — sample LM-B7",
        description: `Terbium-doped borate glass; gyration fitted to the 633 nm run. ${INVENTED}`,
        tags: ["glass", "Tb", "fitted"],
        params: { ...borateGlass },
      },
      {
        by: "lead",
        daysAgo: 3,
        name: "Tb-doped borate glass — sample LM-B7",
        description:
          "Terbium-doped borate glass; " +
          "gyration fitted to the 633 nm run, " +
          `Curie–Weiss θ from the susceptibility sweep. ${INVENTED}`,
        tags: ["glass", "Tb", "fitted"],
        params: { ...borateGlass },
      },
    ],
  },
  {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000c003",
    labId: DEMO_LAB.id,
    versions: [
      {
        by: "lead",
        daysAgo: 7,
        name: "Terbium gallium garnet — 77 K (liquid nitrogen)",
        description: `The handbook garnet cooled in the liquid-nitrogen cryostat. ${INVENTED}`,
        tags: ["TGG", "cryogenic"],
        params: { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 77 },
      },
      {
        by: "postdoc",
        daysAgo: 5,
        name: "Terbium gallium garnet — 77 K (liquid nitrogen)",
        description:
          "The handbook garnet cooled in the liquid-nitrogen cryostat, " +
          "0.5 T (the cryostat's magnet). " +
          `${DIAMAGNETIC_NOTE} ${INVENTED}`,
        tags: ["TGG", "cryogenic", "diamagnetic term"],
        params: { ...TERBIUM_GARNET_DEFAULTS, ...WITH_DIAMAGNETIC, temperatureK: 77, fieldT: 0.5 },
      },
    ],
  },
  {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000c004",
    labId: DEMO_LAB.id,
    versions: [
      {
        by: "postdoc",
        daysAgo: 2,
        name: "Dysprosium gallium garnet — what-if",
        description:
          "A dysprosium analogue of the garnet for comparison (Dy³⁺: g = 4/3, J = 15/2), " +
          `with the diamagnetic (bound-electron) term on. ${INVENTED}`,
        tags: ["Dy", "what-if", "diamagnetic term"],
        params: dysprosiumGarnet,
      },
    ],
  },
  {
    id: OTHER_LAB_SET_ID,
    labId: OTHER_LAB.id,
    versions: [
      {
        by: "outsider",
        daysAgo: 4,
        name: "Cerium-doped glass — Blackfen batch 3",
        description: `Another lab's set; members of other labs must not see it. ${INVENTED}`,
        tags: ["Ce", "glass"],
        params: ceriumGlass,
      },
    ],
  },
];
