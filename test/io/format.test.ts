// The dispatch of the point readers: by extension, by the first characters, never a silent
// misreading (a file named .json holding XML is refused, not read as GeoJSON).
import { describe, expect, it } from 'vitest';
import { dataFormatOf } from '../../src/io/index.js';
import { QuadspreadError } from '../../src/index.js';

const code = (f: () => unknown) => {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(QuadspreadError);
    return (e as QuadspreadError).code;
  }
  return 'no error';
};

describe('dataFormatOf', () => {
  it('reads the extension in any case', () => {
    expect(dataFormatOf('a/b/points.csv')).toBe('csv');
    expect(dataFormatOf('P.TXT')).toBe('csv');
    expect(dataFormatOf('pts.tsv')).toBe('csv');
    expect(dataFormatOf('x.GeoJSON')).toBe('geojson');
    expect(dataFormatOf('x.json')).toBe('geojson');
    expect(dataFormatOf('site.xml')).toBe('landxml');
    expect(dataFormatOf('site.landxml')).toBe('landxml');
  });

  it('reads the first characters when the extension is unknown (BOM and white space skipped)', () => {
    expect(dataFormatOf('points', '\uFEFF  \r\n{"type":"FeatureCollection"}')).toBe('geojson');
    expect(dataFormatOf('points.dat', '<?xml version="1.0"?>')).toBe('landxml');
    expect(dataFormatOf('points.dat', 'name,east,north\n')).toBe('csv');
  });

  it('accepts a text that agrees with the extension', () => {
    expect(dataFormatOf('p.csv', 'name;east;north')).toBe('csv');
    expect(dataFormatOf('p.geojson', '{')).toBe('geojson');
  });

  it('refuses an extension and a text that disagree, and a name it cannot place', () => {
    expect(code(() => dataFormatOf('p.json', '<LandXML>'))).toBe('UNKNOWN_FORMAT');
    expect(code(() => dataFormatOf('p.csv', '{"type":"Feature"}'))).toBe('UNKNOWN_FORMAT');
    expect(code(() => dataFormatOf('p.dat'))).toBe('UNKNOWN_FORMAT');
    expect(code(() => dataFormatOf('p.dat', '  \n'))).toBe('UNKNOWN_FORMAT');
    expect(code(() => dataFormatOf('noextension'))).toBe('UNKNOWN_FORMAT');
  });
});
