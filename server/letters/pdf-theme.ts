/**
 * Fonts and colours of the letter. Fonts are TrueType files shipped with the app
 * through the dejavu-fonts-ttf package and embedded (subset) in every PDF, so a
 * letter looks the same on any machine and never depends on system fonts.
 */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { Decision, Verdict } from '../../shared/api/types';

const require = createRequire(import.meta.url);

/** Folder holding the TrueType files. */
export function fontDir(): string {
  return join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf');
}

/** Font roles the letter uses, mapped to TrueType file names. */
export const FONT_FILES = {
  body: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  italic: 'DejaVuSans-Oblique.ttf',
  condensed: 'DejaVuSansCondensed.ttf',
  condensedBold: 'DejaVuSansCondensed-Bold.ttf',
  mono: 'DejaVuSansMono.ttf',
  display: 'DejaVuSerif-Bold.ttf',
} as const;

/** One of the font roles. */
export type FontRole = keyof typeof FONT_FILES;

/** Colours as hex strings. */
export const COLOURS = {
  ink: '#1c2530',
  muted: '#5d6874',
  faint: '#8a949e',
  rule: '#cdd5da',
  panel: '#f3f6f7',
  accent: '#1f5c58',
  white: '#ffffff',
} as const;

/** Colour of each decision's panel bar and headline. */
export const DECISION_COLOURS: Record<Decision, { bar: string; tint: string }> = {
  endorse: { bar: '#2f6f3e', tint: '#eef5ef' },
  'endorse-with-conditions': { bar: '#8a6100', tint: '#fbf5e6' },
  'revise-and-resubmit': { bar: '#9a4a14', tint: '#fbf0e8' },
  'not-endorsed': { bar: '#8e2233', tint: '#f9ecee' },
};

/** Colour of each verdict in the checklist table. */
export const VERDICT_COLOURS: Record<Verdict, string> = {
  met: '#2f6f3e',
  concern: '#8a6100',
  'not-met': '#8e2233',
  'not-applicable': '#5d6874',
};
