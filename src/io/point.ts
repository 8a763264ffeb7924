/**
 * The point every reader of the io entry returns and every writer takes.
 *
 * @module io
 */
import type { Numeric } from '../index.js';

/**
 * A named point as the io readers return it: plane coordinates (x = east, y = north) in the
 * file's unit, in the caller's arithmetic, with the height and the point code when the file
 * has them. Extra fields of a format (a LandXML description, a GeoJSON property) are named in
 * that format's reader.
 */
export interface ExchangePoint<T> {
  /** The point's name, exactly as the file writes it. */
  readonly name: string;
  /** Easting. */
  readonly x: T;
  /** Northing. */
  readonly y: T;
  /** Height (in the file's height system; not converted). */
  readonly height?: T;
  /** Point code (feature code), as written. */
  readonly code?: string;
}

/** A point the writers take: an {@link ExchangePoint} whose values may be numbers or text. */
export interface ExchangePointInput<T> {
  /** The point's name. */
  readonly name: string;
  /** Easting. */
  readonly x: Numeric<T>;
  /** Northing. */
  readonly y: Numeric<T>;
  /** Height (optional). */
  readonly height?: Numeric<T>;
  /** Point code (optional). */
  readonly code?: string;
}
