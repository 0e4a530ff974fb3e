/**
 * How each setup is drawn. Colour is never the only difference: each style also has its own dash
 * pattern and marker shape, so the lines stay apart on a black-and-white print and for anyone who
 * cannot tell the colours apart. Colours are from the Okabe-Ito set chosen for colour-blind readers
 * (Okabe & Ito, "Color Universal Design", 2008), darkened slightly for print.
 */
export type MarkerShape = 'circle' | 'square' | 'triangle' | 'diamond';

export type SeriesStyle = {
  stroke: string;
  /** SVG stroke-dasharray; '' is a solid line. */
  dash: string;
  width: number;
  marker: MarkerShape;
  /** The pattern in words, for the legend's text and for screen readers. */
  dashWords: string;
};

export const seriesStyles: readonly SeriesStyle[] = [
  { stroke: '#1d2329', dash: '', width: 2.6, marker: 'circle', dashWords: 'solid line, round marks' },
  { stroke: '#0061a0', dash: '9 5', width: 2.2, marker: 'square', dashWords: 'long dashes, square marks' },
  { stroke: '#b84a00', dash: '2 4', width: 2.4, marker: 'triangle', dashWords: 'dotted line, triangle marks' },
  { stroke: '#00775a', dash: '12 4 3 4', width: 2.2, marker: 'diamond', dashWords: 'dash-dot line, diamond marks' },
];

export const styleFor = (index: number): SeriesStyle => seriesStyles[((index % seriesStyles.length) + seriesStyles.length) % seriesStyles.length]!;

/** The voltage needed at the plug, and the margin band above it, are drawn in neutral grey. */
export const requiredStyle = { stroke: '#5d6770', dash: '', width: 1.4 };
export const bandFill = '#d9dde0';
