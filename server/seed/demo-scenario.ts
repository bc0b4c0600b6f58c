import type { CraftRole } from '@/shared/schemas/roles';

/**
 * The demo scenario, invented for Trimsheet: Corvid Sailworks builds "Tern", a small solar-sail
 * technology demonstrator. Pelagic Orbital is a second, unrelated organisation whose person must never
 * see Corvid's data. The sign-in fake offers exactly these people.
 */
export interface DemoPerson {
  /** Stable subject identifier at the sign-in fake. */
  subject: string;
  email: string;
  name: string;
  organisation: 'corvid' | 'pelagic';
  isOrgAdmin: boolean;
  /** Role on the organisation's demo craft, if any. */
  craftRole: CraftRole | null;
  /** Subsystems a subsystem owner owns, or a partner has shared with them, by name. */
  subsystems?: string[];
  /** What the person does, shown on the fake's login page. */
  title: string;
}

export const demoOrganisations = {
  corvid: { slug: 'corvid-sailworks', name: 'Corvid Sailworks' },
  pelagic: { slug: 'pelagic-orbital', name: 'Pelagic Orbital' },
} as const;

export const demoCrafts = {
  corvid: { name: 'Tern', description: 'Square-sail technology demonstrator on a 12U bus, four diagonal booms.' },
  pelagic: { name: 'Skerry', description: 'Drag sail for end-of-life deorbit of a 50 kg satellite.' },
} as const;

export const demoPeople: DemoPerson[] = [
  {
    subject: 'demo-ines',
    email: 'ines.marlowe@corvid-sailworks.example',
    name: 'Ines Marlowe',
    organisation: 'corvid',
    isOrgAdmin: true,
    craftRole: null,
    title: 'Organisation admin',
  },
  {
    subject: 'demo-tomas',
    email: 'tomas.reyes@corvid-sailworks.example',
    name: 'Tomás Reyes',
    organisation: 'corvid',
    isOrgAdmin: false,
    craftRole: 'chief_engineer',
    title: 'Chief engineer',
  },
  {
    subject: 'demo-amara',
    email: 'amara.osei@corvid-sailworks.example',
    name: 'Amara Osei',
    organisation: 'corvid',
    isOrgAdmin: false,
    craftRole: 'systems_engineer',
    title: 'Systems engineer',
  },
  {
    subject: 'demo-kenji',
    email: 'kenji.hollis@corvid-sailworks.example',
    name: 'Kenji Hollis',
    organisation: 'corvid',
    isOrgAdmin: false,
    craftRole: 'subsystem_owner',
    subsystems: ['Booms', 'Deployer'],
    title: 'Subsystem owner (booms, deployer)',
  },
  {
    subject: 'demo-lucia',
    email: 'lucia.brandt@corvid-sailworks.example',
    name: 'Lucia Brandt',
    organisation: 'corvid',
    isOrgAdmin: false,
    craftRole: 'partner',
    subsystems: ['Sail membrane'],
    title: 'Partner (film supplier)',
  },
  {
    subject: 'demo-oren',
    email: 'oren.vasquez@corvid-sailworks.example',
    name: 'Oren Vasquez',
    organisation: 'corvid',
    isOrgAdmin: false,
    craftRole: 'viewer',
    title: 'Viewer',
  },
  {
    subject: 'demo-priya',
    email: 'priya.lund@pelagic-orbital.example',
    name: 'Priya Lund',
    organisation: 'pelagic',
    isOrgAdmin: true,
    craftRole: 'chief_engineer',
    title: 'Another organisation (admin and chief engineer)',
  },
];

/** A change a demo person made to a row, by key. */
export interface DemoChange {
  key: string;
  change: { value?: string; subsystem?: string; note?: string };
}

/**
 * A step of Tern's history, in order: a change to the working draft, the chief engineer locking the draft
 * as a baseline for a review, or someone opening a study of the draft and changing rows in it.
 */
export type DemoStep =
  | ({ kind: 'edit'; subject: string } & DemoChange)
  | { kind: 'lock'; subject: string; label: string; note: string }
  | { kind: 'study'; subject: string; name: string; note: string; changes: DemoChange[] };

/**
 * Tern's story so far (invented): the systems engineer gives the deployer its own subsystem and the boom
 * owner puts in the lighter boom from the supplier's sample; the chief engineer locks that as the "PDR"
 * baseline for the preliminary design review. Since then the sail has grown to win back acceleration and
 * the mass allocation was raised after the launch-slot change, and the boom owner is trying a lighter
 * deployer hinge in a study of his own.
 */
export const ternStory: DemoStep[] = [
  { kind: 'edit', subject: 'demo-amara', key: 'deployer_mass', change: { subsystem: 'Deployer' } },
  {
    kind: 'edit',
    subject: 'demo-kenji',
    key: 'boom_linear_density',
    change: { value: '15 g/m', note: 'Sample boom from the supplier, weighed on receipt.' },
  },
  {
    kind: 'lock',
    subject: 'demo-tomas',
    label: 'PDR',
    note: 'Preliminary design review: 40 m sail, sample booms, 35 kg allocation.',
  },
  { kind: 'edit', subject: 'demo-amara', key: 'sail_side', change: { value: '45 m' } },
  {
    kind: 'edit',
    subject: 'demo-tomas',
    key: 'mass_allocation',
    change: { value: '38 kg', note: 'Raised after the move to the larger launch slot.' },
  },
  {
    kind: 'study',
    subject: 'demo-kenji',
    name: 'Lighter deployer hinge',
    note: "The deployer vendor's hinge redesign, before it is qualified.",
    changes: [{ key: 'deployer_mass', change: { value: '4.2 kg', note: 'Vendor estimate for the redesigned hinge, not yet weighed.' } }],
  },
];
