/**
 * The usual cautions wherever laser work is set up or run: recipe pages, the production page and
 * every job sheet. They point to the machine maker's manual and local rules, which come first.
 */
export const LASER_CAUTIONS = [
  'A CO2 engraver is a Class 4 laser product (IEC 60825-1). Never leave it running unattended and keep fire suppression at hand.',
  'Run fume extraction. Wear eye protection rated for the laser’s wavelength whenever the enclosure is open.',
  'Never burn PVC or vinyl: they give off chlorine gas. Keep to the materials the machine maker allows.',
  'Glass can crack and chip. Wear gloves to handle it.',
  'These settings are starting points. Follow local codes, the machine maker’s manual and licensed practice.',
] as const;
