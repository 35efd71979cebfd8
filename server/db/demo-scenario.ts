/**
 * The demo scenario: fictional studios and people of our own invention, with addresses on the
 * reserved `.test` domain (RFC 2606). Any likeness to a real business or person is unintended.
 */
export const DEMO_PASSWORD = 'etch-demo-2026';

export const demoStudios = [
  { slug: 'harbour-light', name: 'Harbour Light Engraving', accentColour: '#1f6f8b', currency: 'USD', units: 'in', contactEmail: 'hello@harbour-light.test' },
  { slug: 'fernhill-stone', name: 'Fernhill Stoneworks', accentColour: '#7a5c3e', currency: 'GBP', units: 'mm', contactEmail: 'studio@fernhill-stone.test' },
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
