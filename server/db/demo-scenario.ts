/**
 * The demo scenario: fictional studios and people of our own invention, with addresses on the
 * reserved `.test` domain (RFC 2606). Any likeness to a real business or person is unintended.
 */
export const DEMO_PASSWORD = 'etch-demo-2026';

export const demoStudios = [
  {
    slug: 'harbour-light',
    name: 'Harbour Light Engraving',
    accentColour: '#1f6f8b',
    currency: 'USD',
    units: 'in',
    contactEmail: 'hello@harbour-light.test',
  },
  {
    slug: 'fernhill-stone',
    name: 'Fernhill Stoneworks',
    accentColour: '#7a5c3e',
    currency: 'GBP',
    units: 'mm',
    contactEmail: 'studio@fernhill-stone.test',
  },
] as const;

type DemoPerson = {
  email: string;
  name: string;
  /** Members sign in with the demo password; the buyer by e-mailed link. */
  password: boolean;
  platformAdmin?: boolean;
  memberships: Array<{ studio: (typeof demoStudios)[number]['slug']; role: 'owner' | 'staff' }>;
};

export const demoPeople: DemoPerson[] = [
  { email: 'maren@harbour-light.test', name: 'Maren Quist', password: true, memberships: [{ studio: 'harbour-light', role: 'owner' }] },
  { email: 'tobias@harbour-light.test', name: 'Tobias Renn', password: true, memberships: [{ studio: 'harbour-light', role: 'staff' }] },
  { email: 'isla@fernhill-stone.test', name: 'Isla Brennock', password: true, memberships: [{ studio: 'fernhill-stone', role: 'owner' }] },
  { email: 'dev@fernhill-stone.test', name: 'Dev Okafor', password: true, memberships: [{ studio: 'fernhill-stone', role: 'staff' }] },
  { email: 'admin@etchwell.test', name: 'Pia Lindqvist', password: true, platformAdmin: true, memberships: [] },
  { email: 'june@buyers.test', name: 'June Aldous', password: false, memberships: [] },
];

/** Each demo studio's machine, glass or stone blanks and sizes (prices in the studio's minor units). */
export const demoCatalog = {
  'harbour-light': {
    shipping: [
      { name: 'Tracked post, 3–5 working days', priceMinor: 895 },
      { name: 'Express courier, next working day', priceMinor: 1950 },
    ],
    pickup: 'Collect from 14 Quay Lane, Port Alder, Tuesday to Saturday, 10:00–17:00.',
    machine: {
      name: 'Workshop CO2, 100 W',
      laserKind: 'co2',
      powerWatts: 100,
      bedWidthMm: 900,
      bedHeightMm: 600,
      speedUnit: 'in/s',
      notes: 'Lens 2.0 in; air assist on for glass.',
    },
    recipeMaterial: 'Black-backed (painted) glass',
    blanks: [
      {
        name: 'Black-backed glass portrait',
        description:
          'A pane of clear glass painted black on the back: your photo is engraved into the paint and glows pale against the black.',
        material: 'Black-backed (painted) glass',
        shape: 'rounded-rectangle',
        sizes: [
          {
            label: '5 × 7 in',
            outerWidthMm: 127,
            outerHeightMm: 177.8,
            areaWidthMm: 114.3,
            areaHeightMm: 165.1,
            orientation: 'either',
            priceMinor: 4900,
            stock: 24,
            sku: 'HL-GLS-57',
          },
          {
            label: '8 × 10 in',
            outerWidthMm: 203.2,
            outerHeightMm: 254,
            areaWidthMm: 190.5,
            areaHeightMm: 241.3,
            orientation: 'either',
            priceMinor: 6900,
            stock: 12,
            sku: 'HL-GLS-810',
          },
        ],
      },
      {
        name: 'Maple keepsake plaque',
        description: 'Hard maple with a soft oiled finish; the photo burns warm brown.',
        material: 'Maple',
        shape: 'rectangle',
        sizes: [
          {
            label: '6 × 8 in',
            outerWidthMm: 152.4,
            outerHeightMm: 203.2,
            areaWidthMm: 139.7,
            areaHeightMm: 190.5,
            orientation: 'portrait',
            priceMinor: 3900,
            stock: null,
            sku: 'HL-MPL-68',
          },
        ],
      },
    ],
  },
  'fernhill-stone': {
    shipping: [{ name: 'Tracked parcel, 2–4 days', priceMinor: 695 }],
    pickup: '',
    machine: {
      name: 'Stone room CO2, 80 W',
      laserKind: 'co2',
      powerWatts: 80,
      bedWidthMm: 700,
      bedHeightMm: 500,
      speedUnit: 'mm/s',
      notes: '',
    },
    recipeMaterial: 'Black granite',
    blanks: [
      {
        name: 'Black granite memorial tile',
        description: 'Polished black granite; the engraving shows as fine grey dots.',
        material: 'Black granite',
        shape: 'rectangle',
        sizes: [
          {
            label: '150 × 150 mm',
            outerWidthMm: 150,
            outerHeightMm: 150,
            areaWidthMm: 130,
            areaHeightMm: 130,
            orientation: 'either',
            priceMinor: 3500,
            stock: 8,
            sku: 'FS-GRN-150',
          },
          {
            label: '200 × 300 mm',
            outerWidthMm: 200,
            outerHeightMm: 300,
            areaWidthMm: 180,
            areaHeightMm: 280,
            orientation: 'portrait',
            priceMinor: 5900,
            stock: 4,
            sku: 'FS-GRN-200',
          },
        ],
      },
      {
        name: 'Slate coaster',
        description: 'Natural slate with rough-cut edges.',
        material: 'Slate',
        shape: 'circle',
        sizes: [
          {
            label: '100 mm round',
            outerWidthMm: 100,
            outerHeightMm: 100,
            areaWidthMm: 70,
            areaHeightMm: 70,
            orientation: 'either',
            priceMinor: 1200,
            stock: null,
            sku: 'FS-SLT-100',
          },
        ],
      },
    ],
  },
} as const;
