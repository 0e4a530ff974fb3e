/**
 * A small line builder for SPICE decks: each element goes out with a comment line above it
 * saying what it is and in which unit, so an engineer can read the deck without the app.
 */
import { spiceNumber } from './spice-number.js';

export class DeckWriter {
  private readonly lines: string[] = [];

  /** SPICE ignores the first line of a deck as its title; keep it on one line. */
  constructor(title: string) {
    this.lines.push(title.replace(/[\r\n]+/g, ' ').trim() || 'ignition deck');
  }

  comment(text: string): this {
    for (const line of text.split('\n')) this.lines.push(`* ${line}`.trimEnd());
    return this;
  }

  blank(): this {
    this.lines.push('');
    return this;
  }

  /** One element: `name node node value`, numbers written with engineering suffixes. */
  element(what: string, name: string, nodes: readonly string[], value: number | string): this {
    this.comment(what);
    const v = typeof value === 'number' ? spiceNumber(value) : value;
    this.lines.push(`${name} ${nodes.join(' ')} ${v}`);
    return this;
  }

  /** A dot-card or any raw line (models, analyses, measurements). */
  raw(line: string): this {
    this.lines.push(line);
    return this;
  }

  text(): string {
    return `${this.lines.join('\n')}\n`;
  }
}

export const n = spiceNumber;

/** A time point: 12 significant digits, so a 10 ns edge after 100 ms is still a later time. */
export const t = (seconds: number): string => spiceNumber(seconds, 12);
