/**
 * The invented people of the demo season. Every name, club, shop and team here is
 * made up; addresses use the reserved example.com domain (RFC 2606).
 */
export const DEMO_PASSWORD = 'cold-tyres-warm-coffee';

export const DEMO_ACCOUNTS = {
  driver: { email: 'maren@example.com', displayName: 'Maren Holloway', note: 'driver' },
  coDriver: { email: 'teo@example.com', displayName: 'Teo Varga', note: 'co-driver of Maren\'s roadster' },
  secondDriver: { email: 'priya@example.com', displayName: 'Priya Castellan', note: 'second driver' },
  classRival: { email: 'wren@example.com', displayName: 'Wren Tolliver', note: 'drives the team\'s other SR car' },
  shopStaff: { email: 'dusty@example.com', displayName: 'Dusty Okonjo', note: 'staff at Kettle Lane Chassis Works' },
  captain: { email: 'ines@example.com', displayName: 'Ines Brandvold', note: 'captain of the Gravel Pit Irregulars' },
  admin: { email: 'admin@example.com', displayName: 'Scrubline Admin', note: 'admin' },
} as const;

export const DEMO_SHOP = 'Kettle Lane Chassis Works';
export const DEMO_SHOP_TAX_RATE_PCT = 8.25;
/** What the demo shop prints under its name on invoices (an invented address; 555 numbers are not in service). */
export const DEMO_SHOP_INVOICE_DETAILS = '7 Kettle Lane, Brindlebury\nTel. 555 0199\nSales tax no. KL-20417';
export const DEMO_TEAM = 'Gravel Pit Irregulars';

/** The demo season's year, and the class factors the demo captain entered for it (invented). */
export const DEMO_SEASON_YEAR = 2026;
export const DEMO_CLASS_FACTORS: readonly (readonly [string, number])[] = [
  ['SR', 0.842],
  ['SH', 0.815],
];
