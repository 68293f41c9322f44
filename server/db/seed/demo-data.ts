// The demo cooperative: an invented group of fruit growers in Herefordshire and the Welsh
// Marches (England). Places and coordinates are real; the cooperative, farms, people,
// suppliers and variety names are our own inventions. Species facts and pest facts are real
// and cite CHECK-VALUES.md (/work/shared) beside each figure.
//
// Invented figures here are demo data only: never use them as check values in tests.

import type { FINDING_KINDS, FarmRole, PlantRole, PropagationMethod, UserRole, UserStatus } from '../../../shared/domain.js';

type FindingKind = (typeof FINDING_KINDS)[number];

export const DEMO_PASSWORD = 'heelwood-demo';

export const COOPERATIVE = {
  name: "Arrow & Frome Fruit Growers' Co-operative",
  region: 'Herefordshire and the Welsh Marches, England',
  hemisphere: 'north' as const,
  timezone: 'Europe/London',
  // CHECK-VALUES "Value of a raised shrub": about 10 (local currency) each, a default the
  // cooperative sets — common practice.
  valuePerPlant: 10,
  currency: 'GBP',
};

// CHECK-VALUES "How much wood a plant can give": a fruiting bush gives no more than about a
// third a year (published pruning rule: garden columns; from memory: extension advice); a
// dedicated stock bed nearly all its new growth (from memory: stool-bed practice in
// Hartmann & Kester). The exact caps are the cooperative's setting, not trade figures.
export const ROLE_CAPS: Record<PlantRole, number> = { stock_bed: 0.9, fruiting_bush: 0.33 };

// ---------------------------------------------------------------------------------------
// Species
// ---------------------------------------------------------------------------------------

export type SpeciesKey =
  | 'blackcurrant'
  | 'redcurrant'
  | 'gooseberry'
  | 'jostaberry'
  | 'elder'
  | 'fig'
  | 'grape'
  | 'willow'
  | 'mulberry'
  | 'apple'
  | 'pear'
  | 'plum'
  | 'quince';

export type SpeciesSeed = {
  key: SpeciesKey;
  scientificName: string;
  commonName: string;
  genus: string;
  propagationMethods: PropagationMethod[];
  defaultCuttingLengthCm: number;
  defaultCuttingDiameterMm: number;
  softTipCm: number;
  strikeRatePrior: number;
  priorStrength: number;
  shadeTolerant: boolean;
  firstCropYears: number;
  restrictionNote: string | null;
  notes: string;
  /** Demo only: a plausible spread of shoots and shoot lengths for wood offers. */
  growth: { stockShoots: [number, number]; bushShoots: [number, number]; stockLenCm: [number, number]; bushLenCm: [number, number] };
  /** A tree in an orchard row rather than a bush in a bed (demo layout only). */
  tree: boolean;
};

const RIBES_RESTRICTION =
  'White pine blister rust (Cronartium ribicola) alternates between Ribes and five-needled pines. ' +
  'Some places ban or restrict growing or moving Ribes (for example some US states ban blackcurrants ' +
  'or require a permit). Check the local plant-health authority before moving cuttings, and carry ' +
  'phytosanitary papers for material that crosses a border.';

const SCION_RESTRICTION =
  'Scion wood that crosses a border needs phytosanitary papers; some fruit-tree diseases are regulated. ' +
  'Check the local plant-health authority before moving wood.';

export const SPECIES: SpeciesSeed[] = [
  {
    key: 'blackcurrant',
    scientificName: 'Ribes nigrum',
    commonName: 'Blackcurrant',
    genus: 'Ribes',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: 20-25 cm, pencil thick, 5-6 buds — published: BBC Gardeners' World,
    // "How to take hardwood cuttings of blackcurrant plants".
    defaultCuttingLengthCm: 22,
    // CHECK-VALUES: about pencil thickness (6-8 mm) — common practice.
    defaultCuttingDiameterMm: 7,
    softTipCm: 10,
    // CHECK-VALUES: Ribes hardwood about 70-80 % with a willow soak, about 90 % with hormone —
    // common practice (no published percentage). Untreated reference 0.7 — common practice.
    strikeRatePrior: 0.7,
    priorStrength: 20,
    // CHECK-VALUES "Shade": gooseberries tolerate more shade than blackcurrants — common practice.
    shadeTolerant: false,
    // CHECK-VALUES: usually the third year after the cutting — common practice.
    firstCropYears: 3,
    restrictionNote: RIBES_RESTRICTION,
    notes: 'Take after leaf fall from the summer’s growth, while dormant (Gardeners’ World; OMAFRA 98-095). Blackcurrants are grown as stools: plant deep so buds below ground shoot.',
    growth: { stockShoots: [10, 24], bushShoots: [5, 12], stockLenCm: [60, 110], bushLenCm: [35, 70] },
    tree: false,
  },
  {
    key: 'redcurrant',
    scientificName: 'Ribes rubrum',
    commonName: 'Red currant',
    genus: 'Ribes',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: at least 15 cm, better 20-30 cm; top bud only above ground —
    // published: L. H. Bailey, Manual of Gardening.
    defaultCuttingLengthCm: 25,
    // CHECK-VALUES: about pencil thickness (6-8 mm) — common practice.
    defaultCuttingDiameterMm: 7,
    softTipCm: 10,
    // Common practice (CHECK-VALUES, Ribes hardwood): 0.7 untreated; no published figure.
    strikeRatePrior: 0.7,
    priorStrength: 20,
    shadeTolerant: false,
    firstCropYears: 3, // CHECK-VALUES: third year after the cutting — common practice.
    restrictionNote: RIBES_RESTRICTION,
    notes: 'White-fruited currants are varieties of this species. Rub out the lower buds so the bush grows on a short leg (Bailey: top bud only above ground).',
    growth: { stockShoots: [8, 20], bushShoots: [4, 10], stockLenCm: [50, 95], bushLenCm: [30, 60] },
    tree: false,
  },
  {
    key: 'gooseberry',
    scientificName: 'Ribes uva-crispa',
    commonName: 'Gooseberry',
    genus: 'Ribes',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: at least 15 cm, better 20-30 cm — published: Bailey, Manual of Gardening.
    defaultCuttingLengthCm: 25,
    defaultCuttingDiameterMm: 7, // CHECK-VALUES: pencil thickness (6-8 mm) — common practice.
    softTipCm: 10,
    // From memory: gooseberries root less readily than currants; no published figure, so a
    // lower untreated reference than the common-practice Ribes 0.7.
    strikeRatePrior: 0.6,
    priorStrength: 20,
    // CHECK-VALUES "Shade": gooseberries tolerate more shade; the shaded side of trees — common practice.
    shadeTolerant: true,
    firstCropYears: 3, // CHECK-VALUES: third year after the cutting — common practice.
    restrictionNote: RIBES_RESTRICTION,
    notes: 'Rub out the lower buds to keep a clean leg. In-row spacing 1.2-1.5 m (Penn State Extension; ATTRA; OMAFRA).',
    growth: { stockShoots: [8, 18], bushShoots: [4, 10], stockLenCm: [45, 85], bushLenCm: [30, 55] },
    tree: false,
  },
  {
    key: 'jostaberry',
    scientificName: 'Ribes × nidigrolaria',
    commonName: 'Jostaberry',
    genus: 'Ribes',
    propagationMethods: ['hardwood'],
    defaultCuttingLengthCm: 25, // CHECK-VALUES: currant/gooseberry 20-30 cm — published: Bailey.
    defaultCuttingDiameterMm: 8, // CHECK-VALUES: pencil thickness (6-8 mm) — common practice.
    softTipCm: 10,
    strikeRatePrior: 0.7, // Common practice for Ribes hardwood; no published figure for jostaberry.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 3, // CHECK-VALUES: third year after the cutting — common practice.
    restrictionNote: RIBES_RESTRICTION,
    notes: 'Blackcurrant × gooseberry hybrid; vigorous and thornless.',
    growth: { stockShoots: [8, 18], bushShoots: [5, 12], stockLenCm: [70, 140], bushLenCm: [50, 90] },
    tree: false,
  },
  {
    key: 'elder',
    scientificName: 'Sambucus nigra',
    commonName: 'Elder',
    genus: 'Sambucus',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: 25-45 cm with 2 node pairs commonly — from memory: Univ. of Missouri Center
    // for Agroforestry elderberry guide; dormant wood pencil thick or more — published:
    // Missouri State Univ. MS thesis (bearworks 4120).
    defaultCuttingLengthCm: 30,
    defaultCuttingDiameterMm: 10,
    softTipCm: 15,
    strikeRatePrior: 0.6, // Common practice, no published figure.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 3, // Common practice for shrubs (CHECK-VALUES: third year after the cutting).
    restrictionNote: null,
    notes: 'One- and two-node cuttings root alike (Missouri State Univ. thesis, bearworks 4120).',
    growth: { stockShoots: [6, 14], bushShoots: [4, 9], stockLenCm: [100, 190], bushLenCm: [60, 120] },
    tree: false,
  },
  {
    key: 'fig',
    scientificName: 'Ficus carica',
    commonName: 'Fig',
    genus: 'Ficus',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: about 30 cm dormant wood under 2.5 cm thick; or 25-40 cm with three
    // quarters buried — published: California Rare Fruit Growers, "Fig Fruit Facts".
    defaultCuttingLengthCm: 30,
    defaultCuttingDiameterMm: 15,
    softTipCm: 10,
    strikeRatePrior: 0.6, // Common practice, no published figure.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 3, // Common practice.
    restrictionNote: null,
    notes: 'Bury about three quarters of the cutting (California Rare Fruit Growers). Tender when young: give shelter from frost.',
    growth: { stockShoots: [4, 10], bushShoots: [3, 8], stockLenCm: [50, 100], bushLenCm: [40, 80] },
    tree: true,
  },
  {
    key: 'grape',
    scientificName: 'Vitis vinifera',
    commonName: 'Grape vine',
    genus: 'Vitis',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: 30-45 cm, 4 buds (3 below ground, 1 above), slightly thicker than a
    // pencil — published: eXtension grape FAQ.
    defaultCuttingLengthCm: 40,
    defaultCuttingDiameterMm: 8,
    softTipCm: 15,
    // CHECK-VALUES: about half root untreated — published: Iowa State Horticulture News,
    // 5 Mar 1999 (and 23 % untreated for 'Norton', Keeley et al. 2004).
    strikeRatePrior: 0.5,
    priorStrength: 30,
    shadeTolerant: false,
    firstCropYears: 3, // Common practice.
    restrictionNote: SCION_RESTRICTION,
    notes: 'Rooting hormone helps markedly: K-IBA 10,000-15,000 mg/L gave over 70 % against 23 % untreated (Keeley et al. 2004).',
    growth: { stockShoots: [8, 16], bushShoots: [5, 10], stockLenCm: [120, 240], bushLenCm: [90, 160] },
    tree: false,
  },
  {
    key: 'willow',
    scientificName: 'Salix viminalis',
    commonName: 'Osier willow',
    genus: 'Salix',
    propagationMethods: ['live_stake', 'hardwood'],
    // CHECK-VALUES: live stake 1-3 cm x 50-90 cm, dormant, two thirds to three quarters
    // buried — published: riparian habitat restoration guidance (Kansas Forest Service);
    // from memory: USDA-NRCS Engineering Field Handbook Part 650 ch. 16.
    defaultCuttingLengthCm: 70,
    defaultCuttingDiameterMm: 20,
    softTipCm: 20,
    strikeRatePrior: 0.85, // Common practice (willow roots very readily), no published figure.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 2, // From memory: a first cut of rods the second winter.
    restrictionNote: null,
    notes: 'Cut as live stakes for hedges, banks and windbreaks; soak water from willow is used on other cuttings.',
    growth: { stockShoots: [10, 28], bushShoots: [6, 14], stockLenCm: [150, 260], bushLenCm: [100, 180] },
    tree: false,
  },
  {
    key: 'mulberry',
    scientificName: 'Morus nigra',
    commonName: 'Black mulberry',
    genus: 'Morus',
    propagationMethods: ['hardwood', 'leafy'],
    // CHECK-VALUES: current-season wood 25-30 cm with a heel, three quarters buried —
    // published: Plants For A Future.
    defaultCuttingLengthCm: 28,
    defaultCuttingDiameterMm: 10,
    softTipCm: 10,
    strikeRatePrior: 0.4, // From memory: black mulberry is slow to root; no published figure.
    priorStrength: 10,
    shadeTolerant: false,
    firstCropYears: 5, // From memory: slow to come into bearing.
    restrictionNote: null,
    notes: 'Take each cutting with a heel of older wood (Plants For A Future).',
    growth: { stockShoots: [3, 8], bushShoots: [3, 7], stockLenCm: [40, 80], bushLenCm: [35, 70] },
    tree: true,
  },
  {
    key: 'apple',
    scientificName: 'Malus domestica',
    commonName: 'Apple (scion wood)',
    genus: 'Malus',
    propagationMethods: ['scion'],
    // CHECK-VALUES: one-year wood, 15-30 cm sticks, about 6 mm thick, at least 3 buds, tip
    // discarded — published: K-State Horticulture Newsletter; Texas A&M whip grafting.
    defaultCuttingLengthCm: 20,
    defaultCuttingDiameterMm: 6,
    softTipCm: 10,
    strikeRatePrior: 0.8, // Graft take — common practice, no published figure.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 3, // From memory: on a dwarfing rootstock.
    restrictionNote: SCION_RESTRICTION,
    notes: 'Store at 0-2 °C, never frozen, sealed, away from ripening fruit; keeps 3-6 months (CHECK-VALUES "Scion storage").',
    growth: { stockShoots: [10, 30], bushShoots: [8, 20], stockLenCm: [30, 70], bushLenCm: [25, 60] },
    tree: true,
  },
  {
    key: 'pear',
    scientificName: 'Pyrus communis',
    commonName: 'Pear (scion wood)',
    genus: 'Pyrus',
    propagationMethods: ['scion'],
    defaultCuttingLengthCm: 20, // CHECK-VALUES: scion 15-30 cm — published: K-State.
    defaultCuttingDiameterMm: 6, // CHECK-VALUES: about 6 mm — published: K-State.
    softTipCm: 10,
    strikeRatePrior: 0.8, // Graft take — common practice, no published figure.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 4, // From memory.
    restrictionNote: SCION_RESTRICTION,
    notes: 'Perry and dessert pears; scion wood cut in deep winter and stored cold.',
    growth: { stockShoots: [8, 24], bushShoots: [6, 16], stockLenCm: [30, 70], bushLenCm: [25, 60] },
    tree: true,
  },
  {
    key: 'plum',
    scientificName: 'Prunus domestica',
    commonName: 'Plum (scion wood)',
    genus: 'Prunus',
    propagationMethods: ['scion'],
    defaultCuttingLengthCm: 20, // CHECK-VALUES: scion 15-30 cm — published: K-State.
    defaultCuttingDiameterMm: 6, // CHECK-VALUES: about 6 mm — published: K-State.
    softTipCm: 10,
    strikeRatePrior: 0.7, // Graft take — common practice, no published figure.
    priorStrength: 15,
    shadeTolerant: false,
    firstCropYears: 3, // From memory.
    restrictionNote: SCION_RESTRICTION,
    notes: 'Graft late in spring as buds break on the rootstock.',
    growth: { stockShoots: [8, 24], bushShoots: [6, 16], stockLenCm: [30, 70], bushLenCm: [25, 60] },
    tree: true,
  },
  {
    key: 'quince',
    scientificName: 'Cydonia oblonga',
    commonName: 'Quince',
    genus: 'Cydonia',
    propagationMethods: ['hardwood', 'scion'],
    defaultCuttingLengthCm: 25, // From memory: hardwood cuttings as for currants, 20-30 cm.
    defaultCuttingDiameterMm: 8, // CHECK-VALUES: about pencil thickness — common practice.
    softTipCm: 10,
    strikeRatePrior: 0.5, // From memory; no published figure.
    priorStrength: 10,
    shadeTolerant: false,
    firstCropYears: 4, // From memory.
    restrictionNote: SCION_RESTRICTION,
    notes: 'Roots from hardwood cuttings; also grafted.',
    growth: { stockShoots: [6, 14], bushShoots: [4, 10], stockLenCm: [40, 80], bushLenCm: [30, 60] },
    tree: true,
  },
];

// ---------------------------------------------------------------------------------------
// Varieties (invented names)
// ---------------------------------------------------------------------------------------

export type VarietySeed = { key: string; species: SpeciesKey; name: string; description: string };

export const VARIETIES: VarietySeed[] = [
  { key: 'bc-ledbury', species: 'blackcurrant', name: 'Ledbury Sable', description: 'Mid-season; long strigs of large, glossy berries; upright.' },
  { key: 'bc-hollow', species: 'blackcurrant', name: 'Hollow Lane', description: 'Late flowering, misses most spring frosts; sharp flavour.' },
  { key: 'bc-arrow', species: 'blackcurrant', name: 'Arrow Dusk', description: 'Early; compact bush that suits a garden hedge.' },
  { key: 'bc-cowlease', species: 'blackcurrant', name: 'Cowlease Late', description: 'Very late; heavy cropper on damp ground.' },
  { key: 'bc-stoney', species: 'blackcurrant', name: 'Stoney Bank', description: 'Mid-late; sweet enough to eat raw; spreading habit.' },
  { key: 'rc-garnet', species: 'redcurrant', name: 'Garnet Stile', description: 'Early red; long trusses, bright colour.' },
  { key: 'rc-pembridge', species: 'redcurrant', name: 'Pembridge Ruby', description: 'Mid-season red; upright, easy to train as a cordon.' },
  { key: 'rc-lantern', species: 'redcurrant', name: 'Lantern Row', description: 'Late red; hangs well on the bush.' },
  { key: 'rc-bodenham', species: 'redcurrant', name: 'Bodenham Red', description: 'Vigorous red for jelly; tolerates a windy site.' },
  { key: 'wc-moonlace', species: 'redcurrant', name: 'Moonlace', description: 'White-fruited; translucent, sweet berries.' },
  { key: 'wc-milkstone', species: 'redcurrant', name: 'Milkstone', description: 'White-fruited; late, small bush.' },
  { key: 'gb-hedgehog', species: 'gooseberry', name: 'Hedgehog Gold', description: 'Yellow dessert berry; very thorny.' },
  { key: 'gb-wormsley', species: 'gooseberry', name: 'Wormsley Green', description: 'Green culinary berry, picked early for pies.' },
  { key: 'gb-sallow', species: 'gooseberry', name: 'Sallow Blush', description: 'Red-flushed dessert berry; weeping habit.' },
  { key: 'gb-brindle', species: 'gooseberry', name: 'Brindle Gage', description: 'Streaked green and amber; good flavour; upright.' },
  { key: 'js-tumbledown', species: 'jostaberry', name: 'Tumbledown', description: 'Tall, thornless; dark berries in clusters.' },
  { key: 'js-marches', species: 'jostaberry', name: 'Marches Twofold', description: 'Compact; berries between currant and gooseberry in size.' },
  { key: 'el-cordial', species: 'elder', name: 'Cordial Queen', description: 'Large flat flower heads; good for cordial.' },
  { key: 'el-dinmore', species: 'elder', name: 'Dinmore Umbel', description: 'Heavy crops of berries that ripen together.' },
  { key: 'fg-wall', species: 'fig', name: 'Garden Wall Purple', description: 'Hardy purple fig for a south wall.' },
  { key: 'fg-bricklayer', species: 'fig', name: "Bricklayer's Green", description: 'Green-skinned, amber flesh; needs shelter.' },
  { key: 'gr-frome', species: 'grape', name: 'Frome Valley Blue', description: 'Black wine grape; ripens in a cool summer.' },
  { key: 'gr-greyhound', species: 'grape', name: 'Greyhound Blanc', description: 'White wine grape; early.' },
  { key: 'gr-wallside', species: 'grape', name: 'Wallside Black', description: 'Dessert grape for a warm wall.' },
  { key: 'wl-rod', species: 'willow', name: 'Riverside Rod', description: 'Long straight rods for stakes and weaving.' },
  { key: 'wl-withy', species: 'willow', name: 'Withy Green', description: 'Fine green rods; dense hedge.' },
  { key: 'mb-rectory', species: 'mulberry', name: 'Old Rectory', description: 'Large dark fruit; slow-growing, wide tree.' },
  { key: 'mb-churchyard', species: 'mulberry', name: 'Churchyard Black', description: 'Heavy cropper; fruit stains everything.' },
  { key: 'ap-kestrel', species: 'apple', name: 'Kestrel Sweet', description: 'Sweet cider apple; biennial unless thinned.' },
  { key: 'ap-lantern', species: 'apple', name: 'Harvest Lantern', description: 'Early dessert apple, red-flushed.' },
  { key: 'ap-dusk', species: 'apple', name: "Cidermaker's Dusk", description: 'Bittersweet cider apple; late.' },
  { key: 'ap-keeper', species: 'apple', name: 'Longnight Keeper', description: 'Russeted dessert apple; keeps until spring.' },
  { key: 'pr-copper', species: 'pear', name: 'Copper Bell', description: 'Russeted dessert pear.' },
  { key: 'pr-hollowbrook', species: 'pear', name: 'Hollowbrook Perry', description: 'Small, astringent perry pear; long-lived tree.' },
  { key: 'pl-gatepost', species: 'plum', name: 'Gatepost Yellow', description: 'Yellow cooking plum; self-fertile.' },
  { key: 'pl-bramble', species: 'plum', name: 'Bramblecot Blue', description: 'Blue dessert plum; late.' },
  { key: 'qu-lamplight', species: 'quince', name: 'Lamplight', description: 'Pear-shaped golden fruit; fragrant.' },
];

// ---------------------------------------------------------------------------------------
// Pests and diseases catalogue (real organisms; CHECK-VALUES "Plant health: what travels in wood")
// ---------------------------------------------------------------------------------------

export type PestSeed = {
  code: string;
  name: string;
  scientificName: string | null;
  kind: FindingKind;
  travelsInWood: boolean;
  genera: string[];
  signs: string;
  advice: string;
  source: string;
};

export const PESTS: PestSeed[] = [
  {
    code: 'BRV',
    name: 'Blackcurrant reversion virus',
    scientificName: 'Blackcurrant reversion virus (BRV)',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Ribes'],
    signs: 'Leaves with fewer main veins and fewer teeth at the edge; flower buds bright magenta and hairless instead of grey and downy; crops fall away over a few seasons.',
    advice: 'No cure. Take no wood. Put the plant on hold, confirm, then grub out and burn it and replace it from clean, certified stock. Control big bud mite, which carries the virus.',
    source: 'CHECK-VALUES: published, EPPO Reporting Service 1997/153; Zurn et al., Plant Disease 103:1051. Signs from memory.',
  },
  {
    code: 'BBM',
    name: 'Big bud mite',
    scientificName: 'Cecidophyopsis ribis',
    kind: 'pest',
    travelsInWood: true,
    genera: ['Ribes'],
    signs: 'Swollen, round buds in winter and early spring, like tiny cabbages, that fail to open. The mites carry blackcurrant reversion virus.',
    advice: 'Reject any wood with swollen round buds. Pick off and burn swollen buds on a lightly affected bush; a heavily infested bush is usually removed. The plant goes on hold until a coordinator lifts it.',
    source: 'CHECK-VALUES: published, fruit disease references; Which? Gardening.',
  },
  {
    code: 'AGM',
    name: 'American gooseberry mildew',
    scientificName: 'Podosphaera mors-uvae',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Ribes'],
    signs: 'White powdery felt on shoot tips, leaves and fruit, turning brown and felty; stunted, distorted tips.',
    advice: 'Overwinters in buds and shoots: take no wood from an affected bush. Cut out affected tips in late summer, prune for air flow, go easy on nitrogen.',
    source: 'CHECK-VALUES: published, RHS, "Gooseberry mildew".',
  },
  {
    code: 'WPBR',
    name: 'White pine blister rust',
    scientificName: 'Cronartium ribicola',
    kind: 'disease',
    // Recorded as not travelling: the risk on dormant, leafless wood is low (CHECK-VALUES).
    // The legal restrictions on moving Ribes are carried by the species' restriction note,
    // which is shown wherever Ribes wood is offered.
    travelsInWood: false,
    genera: ['Ribes', 'Pinus'],
    signs: 'Yellow spots on Ribes leaves in summer with orange, later brown hair-like rust columns underneath; on five-needled pines, swollen cankers with orange blisters.',
    advice: 'Low risk on dormant wood, but some places restrict growing or moving Ribes (some US states ban blackcurrants or require a permit). Check the local plant-health authority before moving cuttings. Rake up and remove fallen leaves.',
    source: 'CHECK-VALUES: published, North Carolina 02 NCAC 48A .04; Ohio Admin. Code 901:5-43; Oregon Dept. of Agriculture; biology from memory (Maloy 1997).',
  },
  {
    code: 'CCM',
    name: 'Currant clearwing moth',
    scientificName: 'Synanthedon tipuliformis',
    kind: 'pest',
    travelsInWood: true,
    genera: ['Ribes'],
    signs: 'Shoots wilt and die back in early summer; a cut stem shows a black tunnel in the pith where the larva fed.',
    advice: 'Before taking wood, cut across a few stems: reject any with black-tunnelled pith. Cut out and burn affected shoots.',
    source: 'CHECK-VALUES: published, INRA HYPPZ.',
  },
  {
    code: 'NEM',
    name: 'Gooseberry sawfly',
    scientificName: 'Nematus ribesii',
    kind: 'pest',
    travelsInWood: false,
    genera: ['Ribes'],
    signs: 'Green, black-spotted larvae strip the leaves from the centre of the bush outwards, from late spring to late summer.',
    advice: 'Pupates in the soil, not in the wood: cuttings are safe. Look over bushes from mid-spring and pick off the larvae.',
    source: 'CHECK-VALUES: published, Which? Gardening.',
  },
  {
    code: 'DRE',
    name: 'Currant leaf spot',
    scientificName: 'Drepanopeziza ribis',
    kind: 'disease',
    travelsInWood: false,
    genera: ['Ribes'],
    signs: 'Small dark brown spots on the leaves from early summer, running together; leaves fall early.',
    advice: 'Low risk in dormant wood: it overwinters on fallen leaves. Rake up and remove fallen leaves; cuttings may be taken.',
    source: 'CHECK-VALUES: published, RHS; PNW Plant Disease Handbook.',
  },
  {
    code: 'GFLV',
    name: 'Grapevine fanleaf virus',
    scientificName: 'Grapevine fanleaf virus (GFLV)',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Vitis'],
    signs: 'Fan-shaped, misshapen leaves with a wide-open stalk sinus; yellow mosaic or yellow bands along the veins; short internodes and double nodes; poor fruit set.',
    advice: 'Spread in propagation wood and by a soil nematode (Xiphinema index). No cure: take no wood; the vine is normally removed.',
    source: 'From memory: standard grapevine virus references.',
  },
  {
    code: 'FMV',
    name: 'Fig mosaic',
    scientificName: 'Fig mosaic virus (FMV)',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Ficus'],
    signs: 'Yellow-green mottle and mosaic on the leaves, sometimes distorted leaves and rings.',
    advice: 'Spread in cuttings and by the fig mite (Aceria ficus). Take no wood from a mottled tree.',
    source: 'From memory.',
  },
  {
    code: 'NEC',
    name: 'Apple canker',
    scientificName: 'Neonectria ditissima',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Malus', 'Pyrus'],
    signs: 'Sunken, oval cankers with bark flaking in rings, often round a bud or a wound; white pustules in summer, red in winter; shoots beyond a girdling canker die.',
    advice: 'Can be carried in healthy-looking scion wood and nursery trees. Take no scion wood from a cankered tree; cut cankers out to clean wood in dry weather.',
    source: 'From memory.',
  },
  {
    code: 'FIRE',
    name: 'Fireblight',
    scientificName: 'Erwinia amylovora',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Malus', 'Pyrus', 'Cydonia'],
    signs: 'Blossom and shoot tips wilt and turn black as if scorched; tips bend over like a shepherd’s crook; ooze in wet weather.',
    advice: 'Carried in budwood and scion wood. Take no wood; cut out well below the symptoms and disinfect tools between cuts. Regulated in some areas.',
    source: 'From memory.',
  },
  {
    code: 'PPV',
    name: 'Plum pox (sharka)',
    scientificName: 'Plum pox virus (PPV)',
    kind: 'disease',
    travelsInWood: true,
    genera: ['Prunus'],
    signs: 'Pale rings and line patterns on the leaves; blotchy, pitted, misshapen fruit.',
    advice: 'Spread by grafting and by aphids. A quarantine disease in the UK and EU: report a suspected case to the plant-health authority and take no wood.',
    source: 'From memory.',
  },
  {
    code: 'MEL',
    name: 'Willow rust',
    scientificName: 'Melampsora spp.',
    kind: 'disease',
    // Low risk in dormant rods (CHECK-VALUES gives no entry; from memory): recorded as not travelling.
    travelsInWood: false,
    genera: ['Salix'],
    signs: 'Small orange-yellow pustules under the leaves from late summer; early leaf fall; weaker rods.',
    advice: 'Low risk in dormant rods: it overwinters mainly on fallen leaves. Cut stakes from clean-looking rods; grow mixed varieties.',
    source: 'From memory.',
  },
  {
    code: 'ARM',
    name: 'Honey fungus',
    scientificName: 'Armillaria spp.',
    kind: 'disease',
    travelsInWood: false,
    genera: [],
    signs: 'Sudden die-back; a white fungal sheet under the bark at the collar; honey-coloured toadstools in autumn; black bootlace strands in the soil.',
    advice: 'Spreads through soil and roots, not in cutting wood. Remove the plant with as much root as possible; do not replant the same kind of shrub in that spot.',
    source: 'From memory.',
  },
  {
    code: 'VW',
    name: 'Vine weevil',
    scientificName: 'Otiorhynchus sulcatus',
    kind: 'pest',
    travelsInWood: false,
    genera: [],
    signs: 'Notches eaten out of leaf edges by the adults; C-shaped cream grubs at the roots of pot plants.',
    advice: 'Lives in soil and compost, not in stems: wood is safe. Rooted plants in pots can carry grubs — check the root ball before passing plants on.',
    source: 'From memory.',
  },
  {
    code: 'FROST',
    name: 'Frost damage',
    scientificName: null,
    kind: 'disorder',
    travelsInWood: false,
    genera: [],
    signs: 'Blackened, shrivelled shoot tips and young leaves after a late frost; split bark on tender plants.',
    advice: 'Not infectious. Cut wood from below the damage; the soft tip is discarded anyway.',
    source: 'Common practice.',
  },
];

// ---------------------------------------------------------------------------------------
// Farms and their beds
// ---------------------------------------------------------------------------------------

/** One row of a bed: a variety key (or a species key for seedlings), how many plants,
 *  how many years before the current season they were planted, and how they were got. */
export type RowSeed = { v: string; n: number; ago: number; seed?: boolean };
export type BedSeed = { name: string; role: PlantRole; rows: RowSeed[] };

export type FarmSeed = {
  code: string;
  name: string;
  lat: number;
  lon: number;
  address: string;
  directions: string;
  perGrowerLimit: number | null;
  pickupNote: string;
  beds: BedSeed[];
};

// Coordinates are real points on farmland near the villages named (WGS84, decimal degrees).
export const FARMS: FarmSeed[] = [
  {
    code: 'WTH',
    name: 'Wetherstone Farm',
    lat: 51.993,
    lon: -2.505,
    address: 'Wetherstone Lane, near Much Marcle, Ledbury, Herefordshire',
    directions: 'From the A449 take the lane signed for the church, then the second farm track on the left after the cider orchard. Park in the yard by the green barn; the stock beds are behind it.',
    perGrowerLimit: null,
    pickupNote: 'Bundles wait on the trestle inside the green barn, labelled by grower.',
    beds: [
      {
        name: 'Bed 1',
        role: 'stock_bed',
        rows: [
          { v: 'bc-ledbury', n: 6, ago: 15 },
          { v: 'bc-hollow', n: 6, ago: 12 },
          { v: 'rc-garnet', n: 5, ago: 10 },
          { v: 'wc-moonlace', n: 4, ago: 9 },
        ],
      },
      {
        name: 'Bed 2',
        role: 'stock_bed',
        rows: [
          { v: 'gb-hedgehog', n: 5, ago: 8 },
          { v: 'js-tumbledown', n: 3, ago: 7 },
          { v: 'wl-rod', n: 4, ago: 6 },
        ],
      },
      {
        name: 'Orchard',
        role: 'fruiting_bush',
        rows: [
          { v: 'ap-kestrel', n: 3, ago: 18 },
          { v: 'ap-dusk', n: 3, ago: 16 },
          { v: 'pl-gatepost', n: 2, ago: 11 },
        ],
      },
    ],
  },
  {
    code: 'ARB',
    name: 'Arrowbank Nursery',
    lat: 52.217,
    lon: -2.89,
    address: 'Mill Stream Road, Pembridge, Leominster, Herefordshire',
    directions: 'Follow the river road west out of the village for half a mile; the nursery gate is opposite the footbridge. Do not drive onto the osier beds when wet.',
    perGrowerLimit: 300,
    pickupNote: 'Collect from the potting shed by the gate; ring the bell.',
    beds: [
      {
        name: 'Bed 1',
        role: 'stock_bed',
        rows: [
          { v: 'bc-arrow', n: 6, ago: 10 },
          { v: 'bc-stoney', n: 5, ago: 8 },
          { v: 'rc-pembridge', n: 5, ago: 9 },
        ],
      },
      {
        name: 'Osier bed',
        role: 'stock_bed',
        rows: [
          { v: 'wl-rod', n: 4, ago: 12 },
          { v: 'wl-withy', n: 4, ago: 12 },
          { v: 'el-cordial', n: 3, ago: 7 },
        ],
      },
      {
        name: 'Hedge',
        role: 'fruiting_bush',
        rows: [
          { v: 'gb-sallow', n: 4, ago: 6 },
          { v: 'elder', n: 2, ago: 5, seed: true },
        ],
      },
    ],
  },
  {
    code: 'LYN',
    name: 'Lynchet Orchard',
    lat: 52.156,
    lon: -2.87,
    address: 'Lynchet Lane, Weobley, Herefordshire',
    directions: 'Leave Weobley on the Kington road; first right after the garage, then follow the terraced bank uphill. Turning space at the top gate.',
    perGrowerLimit: 200,
    pickupNote: 'Bundles are in the cold store; someone will be in the yard.',
    beds: [
      {
        name: 'Bed 1',
        role: 'stock_bed',
        rows: [
          { v: 'bc-cowlease', n: 6, ago: 11 },
          { v: 'rc-lantern', n: 5, ago: 9 },
          { v: 'wc-milkstone', n: 4, ago: 8 },
        ],
      },
      {
        name: 'Bed 2',
        role: 'stock_bed',
        rows: [
          { v: 'gb-wormsley', n: 5, ago: 10 },
          { v: 'gb-brindle', n: 4, ago: 7 },
        ],
      },
      {
        name: 'Orchard',
        role: 'fruiting_bush',
        rows: [
          { v: 'ap-lantern', n: 3, ago: 17 },
          { v: 'pr-copper', n: 3, ago: 15 },
          { v: 'qu-lamplight', n: 2, ago: 9 },
        ],
      },
    ],
  },
  {
    code: 'FRM',
    name: 'Frome Hollow Farm',
    lat: 52.128,
    lon: -2.493,
    address: 'Hollow Road, Bishop’s Frome, Worcester side of Herefordshire',
    directions: 'From the village green take Hollow Road towards the hop kilns; the farm is the second entrance after the bridge. The vines are on the south-facing slope behind the kilns.',
    perGrowerLimit: null,
    pickupNote: 'Pick up at the kiln door; vine cuttings are kept in damp sand.',
    beds: [
      {
        name: 'Vine bed',
        role: 'stock_bed',
        rows: [
          { v: 'gr-frome', n: 5, ago: 10 },
          { v: 'gr-greyhound', n: 4, ago: 8 },
          { v: 'gr-wallside', n: 3, ago: 6 },
        ],
      },
      {
        name: 'Bed 2',
        role: 'stock_bed',
        rows: [
          { v: 'bc-ledbury', n: 5, ago: 7 },
          { v: 'rc-bodenham', n: 4, ago: 6 },
        ],
      },
      {
        name: 'Wall border',
        role: 'fruiting_bush',
        rows: [
          { v: 'fg-wall', n: 2, ago: 14 },
          { v: 'fg-bricklayer', n: 2, ago: 9 },
        ],
      },
      {
        name: 'Orchard',
        role: 'fruiting_bush',
        rows: [
          { v: 'pr-hollowbrook', n: 3, ago: 16 },
          { v: 'pl-bramble', n: 2, ago: 12 },
        ],
      },
    ],
  },
  {
    code: 'GRS',
    name: 'Gorsty Bank',
    lat: 52.02,
    lon: -2.84,
    address: 'Gorsty Lane, Kingstone, Herefordshire',
    directions: 'From Kingstone crossroads take the lane towards the common; Gorsty Bank is the smallholding with the red gate on the right.',
    perGrowerLimit: 150,
    pickupNote: 'Knock at the house; bundles in the lean-to.',
    beds: [
      {
        name: 'Bed 1',
        role: 'stock_bed',
        rows: [
          { v: 'bc-hollow', n: 5, ago: 9 },
          { v: 'bc-stoney', n: 5, ago: 6 },
          { v: 'js-marches', n: 3, ago: 8 },
        ],
      },
      {
        name: 'Bed 2',
        role: 'stock_bed',
        rows: [
          { v: 'gb-hedgehog', n: 4, ago: 7 },
          { v: 'gb-sallow', n: 4, ago: 5 },
          { v: 'rc-garnet', n: 4, ago: 4 },
        ],
      },
      {
        name: 'Field edge',
        role: 'fruiting_bush',
        rows: [
          { v: 'el-dinmore', n: 3, ago: 13 },
          { v: 'mb-churchyard', n: 1, ago: 16 },
          { v: 'mulberry', n: 1, ago: 10, seed: true },
        ],
      },
    ],
  },
  {
    code: 'HOP',
    name: 'Hopleaf Farm',
    lat: 52.152,
    lon: -2.686,
    address: 'Kiln Lane, Bodenham, Herefordshire',
    directions: 'Turn off the A417 at the Bodenham sign, past the lake entrance; Hopleaf is at the end of Kiln Lane. Park on the hardstanding, not the grass.',
    perGrowerLimit: 250,
    pickupNote: 'Bundles are in crates under the hop-kiln stairs.',
    beds: [
      {
        name: 'Bed 1',
        role: 'stock_bed',
        rows: [
          { v: 'bc-arrow', n: 5, ago: 8 },
          { v: 'bc-cowlease', n: 4, ago: 5 },
          { v: 'wc-moonlace', n: 4, ago: 6 },
        ],
      },
      {
        name: 'Bed 2',
        role: 'stock_bed',
        rows: [
          { v: 'el-cordial', n: 3, ago: 9 },
          { v: 'elder', n: 2, ago: 4, seed: true },
          { v: 'wl-withy', n: 3, ago: 7 },
        ],
      },
      {
        name: 'Orchard',
        role: 'fruiting_bush',
        rows: [
          { v: 'ap-keeper', n: 3, ago: 14 },
          { v: 'mb-rectory', n: 1, ago: 18 },
          { v: 'fg-wall', n: 1, ago: 3 },
        ],
      },
    ],
  },
  {
    code: 'RDG',
    name: 'Ridgeway Orchards',
    lat: 52.248,
    lon: -2.705,
    address: 'Ridgeway, Kimbolton, Leominster, Herefordshire',
    directions: 'Take the A4112 towards Tenbury; turn right on the ridge road after the chapel. Second farm; the stock beds are by the polytunnels.',
    perGrowerLimit: null,
    pickupNote: 'Collect from the polytunnel porch; sign the sheet on the clipboard.',
    beds: [
      {
        name: 'Bed 1',
        role: 'stock_bed',
        rows: [
          { v: 'bc-ledbury', n: 5, ago: 6 },
          { v: 'rc-pembridge', n: 4, ago: 5 },
          { v: 'gb-brindle', n: 4, ago: 4 },
        ],
      },
      {
        name: 'Bed 2',
        role: 'stock_bed',
        rows: [
          { v: 'gr-wallside', n: 3, ago: 2 },
          { v: 'js-tumbledown', n: 3, ago: 5 },
        ],
      },
      {
        name: 'Orchard',
        role: 'fruiting_bush',
        rows: [
          { v: 'ap-dusk', n: 4, ago: 17 },
          { v: 'ap-kestrel', n: 3, ago: 15 },
          { v: 'pr-copper', n: 2, ago: 13 },
          { v: 'pl-gatepost', n: 2, ago: 10 },
        ],
      },
    ],
  },
];

export const SUPPLIERS = [
  'Marcher Fruit Nurseries (certified stock)',
  'Old Forge Plant Sales',
  'Brockweir Soft Fruit',
  'Tanhouse Fruit Nursery (certified stock)',
];

// ---------------------------------------------------------------------------------------
// People (invented). All sign in with DEMO_PASSWORD.
// ---------------------------------------------------------------------------------------

export type PersonSeed = {
  key: string;
  name: string;
  email: string;
  role: UserRole;
  status: UserStatus;
  farm?: { code: string; role: FarmRole };
  home?: { place: string; lat: number; lon: number };
  application?: string;
  /** Years before the current season they joined (0 for this year). */
  joinedAgo: number;
  /** How far they will drive to collect, km. */
  maxKm?: number;
};

export const PEOPLE: PersonSeed[] = [
  { key: 'coord', name: 'Ruth Gwillim', email: 'coordinator@heelwood.test', role: 'coordinator', status: 'active', joinedAgo: 9, home: { place: 'Hereford', lat: 52.0565, lon: -2.716 } },
  { key: 'lead', name: 'Tom Bevan', email: 'lead@heelwood.test', role: 'member', status: 'active', farm: { code: 'WTH', role: 'lead' }, joinedAgo: 9 },
  { key: 'hand', name: 'Kasia Nowak', email: 'hand@heelwood.test', role: 'member', status: 'active', farm: { code: 'WTH', role: 'hand' }, joinedAgo: 3 },
  {
    key: 'grower',
    name: 'Sam Okafor',
    email: 'grower@heelwood.test',
    role: 'member',
    status: 'active',
    joinedAgo: 4,
    home: { place: 'Withington, Herefordshire', lat: 52.0855, lon: -2.6385 },
    maxKm: 25,
  },
  { key: 'arb', name: 'Megan Pritchard', email: 'megan.pritchard@heelwood.test', role: 'member', status: 'active', farm: { code: 'ARB', role: 'lead' }, joinedAgo: 9 },
  { key: 'lyn', name: 'Owen Vaughan', email: 'owen.vaughan@heelwood.test', role: 'member', status: 'active', farm: { code: 'LYN', role: 'lead' }, joinedAgo: 9 },
  { key: 'frm', name: 'Priya Sandhu', email: 'priya.sandhu@heelwood.test', role: 'member', status: 'active', farm: { code: 'FRM', role: 'lead' }, joinedAgo: 8 },
  { key: 'grs', name: 'Dafydd Parry', email: 'dafydd.parry@heelwood.test', role: 'member', status: 'active', farm: { code: 'GRS', role: 'lead' }, joinedAgo: 9 },
  { key: 'hop', name: 'Alice Meredith', email: 'alice.meredith@heelwood.test', role: 'member', status: 'active', farm: { code: 'HOP', role: 'lead' }, joinedAgo: 8 },
  { key: 'rdg', name: 'George Watkins', email: 'george.watkins@heelwood.test', role: 'member', status: 'active', farm: { code: 'RDG', role: 'lead' }, joinedAgo: 7 },
  { key: 'arbhand', name: 'Liam Probert', email: 'liam.probert@heelwood.test', role: 'member', status: 'active', farm: { code: 'ARB', role: 'hand' }, joinedAgo: 4 },
  { key: 'hophand', name: 'Nia Morgan', email: 'nia.morgan@heelwood.test', role: 'member', status: 'active', farm: { code: 'HOP', role: 'hand' }, joinedAgo: 2 },
  { key: 'joan', name: 'Joan Price', email: 'joan.price@heelwood.test', role: 'member', status: 'active', joinedAgo: 8, home: { place: 'Hereford (Tupsley)', lat: 52.0565, lon: -2.6905 }, maxKm: 30 },
  { key: 'ben', name: 'Ben Ashdown', email: 'ben.ashdown@heelwood.test', role: 'member', status: 'active', joinedAgo: 7, home: { place: 'Ledbury', lat: 52.0355, lon: -2.4235 }, maxKm: 35 },
  { key: 'fatima', name: 'Fatima Rahman', email: 'fatima.rahman@heelwood.test', role: 'member', status: 'active', joinedAgo: 6, home: { place: 'Leominster', lat: 52.2275, lon: -2.7365 }, maxKm: 20 },
  { key: 'hugh', name: 'Hugh Lacey', email: 'hugh.lacey@heelwood.test', role: 'member', status: 'active', joinedAgo: 5, home: { place: 'Staunton on Wye', lat: 52.1055, lon: -2.9305 }, maxKm: 40 },
  { key: 'rosa', name: 'Rosa Delgado', email: 'rosa.delgado@heelwood.test', role: 'member', status: 'active', joinedAgo: 4, home: { place: 'Ross-on-Wye', lat: 51.9145, lon: -2.5855 }, maxKm: 30 },
  { key: 'ewan', name: 'Ewan Tranter', email: 'ewan.tranter@heelwood.test', role: 'member', status: 'active', joinedAgo: 3, home: { place: 'Bromyard', lat: 52.1895, lon: -2.5085 }, maxKm: 25 },
  { key: 'mair', name: 'Mair Lewis', email: 'mair.lewis@heelwood.test', role: 'member', status: 'active', joinedAgo: 2, home: { place: 'Madley', lat: 52.0445, lon: -2.8535 }, maxKm: 20 },
  {
    key: 'derek',
    name: 'Derek Mapp',
    email: 'derek.mapp@heelwood.test',
    role: 'member',
    status: 'suspended',
    joinedAgo: 6,
    home: { place: 'Canon Pyon', lat: 52.1345, lon: -2.7815 },
    maxKm: 30,
  },
  {
    key: 'chris',
    name: 'Chris Hallam',
    email: 'chris.hallam@heelwood.test',
    role: 'member',
    status: 'pending',
    joinedAgo: 0,
    home: { place: 'Clehonger', lat: 52.0405, lon: -2.7805 },
    application:
      'Smallholding of four acres near Clehonger. Planning a 120 m mixed hedge along the lane with blackcurrants and gooseberries between hawthorn, and a nursery bed to raise more. Happy to help at winter cutting days.',
  },
  {
    key: 'anika',
    name: 'Anika Weiss',
    email: 'anika.weiss@heelwood.test',
    role: 'member',
    status: 'pending',
    joinedAgo: 0,
    home: { place: 'Bromyard Downs', lat: 52.1965, lon: -2.4865 },
    application:
      'I look after a community orchard of 40 young trees above Bromyard and would like to plant two currant bushes beside each tree. We can offer willow from our own pollards in return.',
  },
];

/** Exchanges the history must contain: wood from one labelled plant, in the season N winters
 *  before the current one, to named people. A `label` means the receiving farm lead raised a
 *  new mother plant from the bundle, known afterwards by that label. */
export type ForcedExchange = {
  from: string;
  seasonAgo: number;
  to: { grower: string; label?: string; cuttings: number; treatment: 'none' | 'willow' | 'hormone' | 'both' }[];
};

export const LINEAGE_ROOT_CODE = 'WTH-0001';

// The lineage: root (a bought blackcurrant at WTH) -> ARB and LYN -> GRS and HOP -> RDG -> FRM.
// Then the trace case: a blackcurrant now on hold with big bud mite ('exposed', see
// HEALTH_PLAN) gave wood last winter, after its last clean inspection, to a grower and to
// the lead of LYN, who raised a plant from it.
export const FORCED_EXCHANGES: ForcedExchange[] = [
  {
    from: 'root',
    seasonAgo: 7,
    to: [
      { grower: 'arb', label: 'g2', cuttings: 24, treatment: 'willow' },
      { grower: 'lyn', label: 'g2b', cuttings: 16, treatment: 'none' },
    ],
  },
  {
    from: 'g2',
    seasonAgo: 5,
    to: [
      { grower: 'grs', label: 'g3', cuttings: 20, treatment: 'hormone' },
      { grower: 'hop', label: 'g3b', cuttings: 18, treatment: 'willow' },
    ],
  },
  { from: 'g3', seasonAgo: 3, to: [{ grower: 'rdg', label: 'g4', cuttings: 20, treatment: 'both' }] },
  { from: 'g4', seasonAgo: 1, to: [{ grower: 'frm', label: 'g5', cuttings: 16, treatment: 'willow' }] },
  {
    from: 'exposed',
    seasonAgo: 1,
    to: [
      { grower: 'hugh', cuttings: 30, treatment: 'willow' },
      { grower: 'lyn', label: 'exposed-child', cuttings: 12, treatment: 'none' },
    ],
  },
];

export const DISTRICT_NOTES: { author: string; daysAgo: number; lat: number | null; lon: number | null; body: string }[] = [
  {
    author: 'arb',
    daysAgo: 12,
    lat: 52.2185,
    lon: -2.8955,
    body: 'Swollen round buds reported on blackcurrants along the river road west of Pembridge — check your bushes before cutting, and reject any wood with big buds.',
  },
  {
    author: 'coord',
    daysAgo: 40,
    lat: 52.0355,
    lon: -2.4235,
    body: 'American gooseberry mildew seen on garden bushes on the Ledbury side this summer. Look at shoot tips on your gooseberries before you offer wood.',
  },
  {
    author: 'frm',
    daysAgo: 200,
    lat: 52.128,
    lon: -2.493,
    body: 'Hard late frost in the Frome valley: shoot tips blackened on young vines and figs at exposed sites. Cut below the damage; the wood underneath is sound.',
  },
  {
    author: 'coord',
    daysAgo: 95,
    lat: null,
    lon: null,
    body: 'Reminder for cutting days: sharp, clean secateurs, gloves for rooting hormone (follow the label), and a kneeling pad. Wipe blades between farms.',
  },
];

// ---------------------------------------------------------------------------------------
// Health picture: which plants are on watch, on hold or retired (chosen among candidates
// of the right species; the lineage plants stay clean).
// ---------------------------------------------------------------------------------------

export type HealthPlanItem = {
  status: 'hold' | 'watch' | 'retired';
  species: SpeciesKey[] | 'any';
  farm?: string;
  pest: string;
  severity: 'minor' | 'moderate' | 'severe';
  n: number;
  finding: string;
  reason: string;
  /** The first plant chosen is known by this label, and its previous clean inspection falls
   *  in September before last winter, so wood it gave last winter shows up in a trace. */
  label?: string;
};

export const HEALTH_PLAN: HealthPlanItem[] = [
  { status: 'hold', species: ['blackcurrant'], farm: 'ARB', pest: 'BBM', severity: 'moderate', n: 3, finding: 'Several swollen round buds on the lower shoots.', reason: 'Big bud mite found at inspection; no wood until cleared.', label: 'exposed' },
  { status: 'hold', species: ['gooseberry'], pest: 'AGM', severity: 'moderate', n: 1, finding: 'Brown felty mildew on most shoot tips.', reason: 'American gooseberry mildew on the shoot tips; it overwinters in buds and shoots.' },
  { status: 'hold', species: ['redcurrant'], pest: 'CCM', severity: 'moderate', n: 1, finding: 'Two of five test cuts show black-tunnelled pith.', reason: 'Currant clearwing larvae in the pith.' },
  { status: 'hold', species: ['grape'], pest: 'GFLV', severity: 'severe', n: 1, finding: 'Fan-shaped leaves and double nodes on two canes; sample sent for testing.', reason: 'Suspected grapevine fanleaf virus; hold until the test result.' },
  { status: 'hold', species: ['apple'], pest: 'NEC', severity: 'moderate', n: 1, finding: 'Canker girdling a two-year branch on the south side.', reason: 'Apple canker; no scion wood from this tree.' },
  { status: 'retired', species: ['blackcurrant'], pest: 'BRV', severity: 'severe', n: 3, finding: 'Magenta, hairless flower buds and nettle-shaped leaves on half the bush.', reason: 'Reversion confirmed; bush grubbed out and burnt.' },
  { status: 'retired', species: ['gooseberry', 'plum'], pest: 'ARM', severity: 'severe', n: 2, finding: 'Died back in summer; white fungal sheet under the bark at the collar.', reason: 'Honey fungus at the collar; plant removed with its roots.' },
  { status: 'watch', species: ['gooseberry', 'redcurrant', 'blackcurrant'], pest: 'NEM', severity: 'minor', n: 4, finding: 'Sawfly larvae stripped the centre in June; regrowing.', reason: 'Gooseberry sawfly; does not travel in wood, watching regrowth.' },
  { status: 'watch', species: ['blackcurrant', 'redcurrant', 'jostaberry'], pest: 'DRE', severity: 'minor', n: 4, finding: 'Leaf spot on the lower leaves from late summer.', reason: 'Leaf spot; low risk, leaves to be cleared before cutting.' },
  { status: 'watch', species: ['willow'], pest: 'MEL', severity: 'minor', n: 2, finding: 'Rust pustules under the leaves in August.', reason: 'Willow rust; checking rods after leaf fall.' },
  { status: 'watch', species: ['fig', 'grape', 'elder'], pest: 'FROST', severity: 'minor', n: 3, finding: 'Tips blackened by the late frost.', reason: 'Frost damage; checking the wood below the damage.' },
  { status: 'watch', species: 'any', pest: 'VW', severity: 'minor', n: 1, finding: 'Notched leaf edges; adults seen at night.', reason: 'Vine weevil adults; roots to be checked.' },
];

/** How many clean plants have gone more than a year without an inspection. */
export const STALE_PLANTS = 12;

export const CLEAN_NOTES = [
  'Clean. Buds normal; two test cuts show clean pith.',
  'No pests or disease seen.',
  'Clean; good, even growth this year.',
  'Clean. Checked the buds and cut across two stems.',
  'Clean; a few wind-broken shoots removed.',
  'Clean. Mulched after the inspection.',
];

export const PLANT_NOTES = [
  'Vigorous; cut hard every winter as a stool.',
  'Sheltered corner; first to leaf out.',
  'Slow to start this spring after the dry summer.',
  'Labelled on the row post as well as the plant.',
  'Gives long, straight shoots: good cutting wood.',
  'Netted against birds in summer.',
  'Heavy soil here; inclined to waterlog in winter.',
  'Top-dressed with compost each March.',
];

export const STRIKE_NOTES = [
  'Stuck in a trench in the vegetable garden, two thirds buried.',
  'Lined out in a nursery bed; dry May, watered twice.',
  'In deep pots in the cold frame.',
  'Rabbits had a few; the rest grew away well.',
  'Heavy clay; the ones at the wet end failed.',
  '',
];
