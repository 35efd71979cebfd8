import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

/** The app's own font on disk: Nunito's Latin WOFF from @fontsource/nunito, as the browser loads it. */
export const nunitoWoff = (weight: 400 | 600 | 800): string =>
  require.resolve(`@fontsource/nunito/files/nunito-latin-${weight}-normal.woff`);
