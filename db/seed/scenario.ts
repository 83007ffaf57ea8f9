/**
 * The demo scenario: two invented organisations with invented depots, workshops, people and
 * vehicle platforms. Every name here is our own invention; e-mail addresses use the reserved
 * `.example` domain. Masses and ratings of the platforms are invented demo figures.
 */
import type { Role } from "@/lib/permissions";

export const DEMO_PASSWORD = "outback-demo-2026";

export type DemoPerson = { name: string; email: string; role: Role; firm?: string; depot?: string };

export type DemoPlatform = {
  code: string;
  make: string;
  model: string;
  variant: string;
  kerbMassKg: number;
  kerbFrontKg: number;
  gvmKg: number;
  gcmKg: number;
  frontAxleRatingKg: number;
  rearAxleRatingKg: number;
  wheelbaseMm: number;
  rearOverhangMm: number;
  towingCapacityKg: number;
  towballLimitKg: number;
  roofStaticKg: number;
  roofDynamicKg: number;
  standardTyreSize: string;
  fuelCapacityL: number;
  topSpeedKmh: number;
};

export type DemoOrganisation = {
  slug: string;
  name: string;
  approvalThresholdCents: number;
  /** IANA zone the organisation's dates and times read in. */
  timeZone: string;
  depots: { code: string; name: string; region: string }[];
  firms: { name: string; email: string; phone: string; abn: string }[];
  people: DemoPerson[];
  fleetPrefix: string;
  vehicleCount: number;
  platforms: DemoPlatform[];
};

export const PLATFORMS: DemoPlatform[] = [
  {
    code: "CT79",
    make: "Corvane",
    model: "Trailhand 79",
    variant: "single cab chassis",
    kerbMassKg: 2265,
    kerbFrontKg: 1300,
    gvmKg: 3510,
    gcmKg: 6860,
    frontAxleRatingKg: 1750,
    rearAxleRatingKg: 2250,
    wheelbaseMm: 3180,
    rearOverhangMm: 1250,
    towingCapacityKg: 3500,
    towballLimitKg: 350,
    roofStaticKg: 200,
    roofDynamicKg: 150,
    standardTyreSize: "LT265/70R16",
    fuelCapacityL: 130,
    topSpeedKmh: 160,
  },
  {
    code: "MO3",
    make: "Marrak",
    model: "Outback 300",
    variant: "wagon",
    kerbMassKg: 2580,
    kerbFrontKg: 1390,
    gvmKg: 3450,
    gcmKg: 6750,
    frontAxleRatingKg: 1800,
    rearAxleRatingKg: 1900,
    wheelbaseMm: 2850,
    rearOverhangMm: 1050,
    towingCapacityKg: 3500,
    towballLimitKg: 350,
    roofStaticKg: 300,
    roofDynamicKg: 150,
    standardTyreSize: "265/65R18",
    fuelCapacityL: 110,
    topSpeedKmh: 175,
  },
  {
    code: "YT4",
    make: "Yendor",
    model: "Terrus 4",
    variant: "dual cab ute",
    kerbMassKg: 2150,
    kerbFrontKg: 1240,
    gvmKg: 3100,
    gcmKg: 5900,
    frontAxleRatingKg: 1700,
    rearAxleRatingKg: 1900,
    wheelbaseMm: 3090,
    rearOverhangMm: 1300,
    towingCapacityKg: 3500,
    towballLimitKg: 350,
    roofStaticKg: 250,
    roofDynamicKg: 120,
    standardTyreSize: "265/60R18",
    fuelCapacityL: 80,
    topSpeedKmh: 180,
  },
  {
    code: "BK",
    make: "Brolga",
    model: "Kestrel",
    variant: "LC wagon",
    kerbMassKg: 2740,
    kerbFrontKg: 1450,
    gvmKg: 3400,
    gcmKg: 6950,
    frontAxleRatingKg: 1900,
    rearAxleRatingKg: 2050,
    wheelbaseMm: 2850,
    rearOverhangMm: 1100,
    towingCapacityKg: 3500,
    towballLimitKg: 350,
    roofStaticKg: 300,
    roofDynamicKg: 150,
    standardTyreSize: "285/60R18",
    fuelCapacityL: 138,
    topSpeedKmh: 170,
  },
];

export const ORGANISATIONS: DemoOrganisation[] = [
  {
    slug: "mirrabel-health",
    name: "Mirrabel Remote Health Service",
    approvalThresholdCents: 500_000,
    timeZone: "Australia/Darwin",
    depots: [
      { code: "OCW", name: "Ochre Well", region: "Northern plains" },
      { code: "SPC", name: "Salt Pan Creek", region: "Lake country" },
      { code: "TRJ", name: "Tarrin Junction", region: "Ranges" },
    ],
    firms: [
      { name: "Tallowbark Fit-Out Workshop", email: "jobs@tallowbark-fitout.example", phone: "08 5550 1201", abn: "51824753556" },
      { name: "Spindle Flat 4x4 Works", email: "quotes@spindleflat-4x4.example", phone: "08 5550 1388", abn: "33102417974" },
      { name: "Coolabin Auto Electrical", email: "desk@coolabin-auto.example", phone: "08 5550 1444", abn: "62009571138" },
    ],
    people: [
      { name: "Imogen Vale", email: "admin@mirrabel-health.example", role: "admin" },
      { name: "Tomas Reyburn", email: "manager@mirrabel-health.example", role: "manager" },
      { name: "Harriet Coole", email: "manager2@mirrabel-health.example", role: "manager" },
      { name: "Lachlan Ebbett", email: "finance@mirrabel-health.example", role: "finance" },
      { name: "Mina Okoro-Shaw", email: "driver@mirrabel-health.example", role: "driver", depot: "OCW" },
      { name: "Fergus Talland", email: "driver2@mirrabel-health.example", role: "driver", depot: "SPC" },
      { name: "Rowan Pike", email: "contractor@tallowbark-fitout.example", role: "contractor", firm: "Tallowbark Fit-Out Workshop" },
      { name: "Sasha Brennock", email: "contractor@spindleflat-4x4.example", role: "contractor", firm: "Spindle Flat 4x4 Works" },
    ],
    fleetPrefix: "MH",
    vehicleCount: 40,
    platforms: PLATFORMS,
  },
  {
    slug: "gidgee-trust",
    name: "Gidgee Range Parks & Land Trust",
    approvalThresholdCents: 300_000,
    timeZone: "Australia/Perth",
    depots: [
      { code: "BWX", name: "Blackwood Crossing", region: "Western range" },
      { code: "EMS", name: "Emu Soak", region: "Sand plain" },
    ],
    firms: [{ name: "Quandong Road Workshop", email: "office@quandong-road.example", phone: "08 5550 2090", abn: "84115609472" }],
    people: [
      { name: "Odette Marrow", email: "admin@gidgee-trust.example", role: "admin" },
      { name: "Ben Calloway", email: "manager@gidgee-trust.example", role: "manager" },
      { name: "Priti Lonsdale", email: "finance@gidgee-trust.example", role: "finance" },
      { name: "Jem Harrow", email: "driver@gidgee-trust.example", role: "driver", depot: "BWX" },
      { name: "Cass Mundy", email: "contractor@quandong-road.example", role: "contractor", firm: "Quandong Road Workshop" },
    ],
    fleetPrefix: "GT",
    vehicleCount: 10,
    platforms: PLATFORMS.slice(0, 2),
  },
];
