/**
 * The demo scenario: fictional studios of our own invention. Any likeness to a real business is
 * unintended. Later features add their people, catalog and orders here.
 */
export const demoStudios = [
  { slug: 'harbour-light', name: 'Harbour Light Engraving', accentColour: '#1f6f8b' },
  { slug: 'fernhill-stone', name: 'Fernhill Stoneworks', accentColour: '#7a5c3e' },
] as const;
