import { colors } from './theme';

/**
 * The geometry of Trimsheet's mark in a 48-unit square, shared by `SailMark` and the script that draws
 * the favicon (assets/render-favicon.ts): a square sail seen face on, its diamond membrane billowing a
 * little between the boom tips, four booms as a "+" from a hub, and the quadrant the sun lights in amber.
 */
export const sailMarkSize = 48;

const hub = 24;
const tip = { top: 3, right: 45, bottom: 45, left: 3 };
// Control points of the outer edges: a bulge of about 1.5 units outwards at mid-edge.
const near = 11.4;
const far = 36.6;

/** The quadrant between the upper and the right boom, lit by the sun. */
export const litQuadrant = `M${hub} ${hub} L${hub} ${tip.top} Q${far} ${near} ${tip.right} ${hub} Z`;

/** The three quadrants in shade, as one path. */
export const shadedQuadrants = [
  `M${hub} ${hub} L${tip.right} ${hub} Q${far} ${far} ${hub} ${tip.bottom} Z`,
  `M${hub} ${hub} L${hub} ${tip.bottom} Q${near} ${far} ${tip.left} ${hub} Z`,
  `M${hub} ${hub} L${tip.left} ${hub} Q${near} ${near} ${hub} ${tip.top} Z`,
].join(' ');

/** The whole membrane's outline: the favicon rims it in the ground colour, so it keeps its shape on a dark tab bar. */
export const membraneOutline = `M${hub} ${tip.top} Q${far} ${near} ${tip.right} ${hub} Q${far} ${far} ${hub} ${tip.bottom} Q${near} ${far} ${tip.left} ${hub} Q${near} ${near} ${hub} ${tip.top} Z`;

/** The booms, hub to tip, drawn over the membrane. */
export const booms = `M${hub} ${tip.top} L${hub} ${tip.bottom} M${tip.left} ${hub} L${tip.right} ${hub}`;
export const boomWidth = 3.5;
export const hubDot = { cx: hub, cy: hub, r: 6 };

/** Where the mark sits: on the light page (`ground`) or on an ink-blue band or panel (`ink`). */
export type SailMarkBackdrop = 'ground' | 'ink';

/** The mark's colours for its backdrop: the membrane contrasts with it, booms and hub are cut out of it. */
export function sailMarkColors(backdrop: SailMarkBackdrop): { membrane: string; lit: string; booms: string } {
  return backdrop === 'ink'
    ? { membrane: colors.ground, lit: colors.filmOnInk, booms: colors.ink }
    : { membrane: colors.ink, lit: colors.filmOnInk, booms: colors.ground };
}
