/**
 * Reads back the text of a PDF that pdfkit wrote with `compress: false`: each font's ToUnicode map
 * turns the glyph ids of the TJ operators back into characters. Enough for tests to check what a
 * report says; not a general PDF reader.
 */
export function pdfText(pdf: Buffer): string {
  const source = pdf.toString('latin1');
  const objects = new Map<string, string>();
  for (const match of source.matchAll(/(\d+) 0 obj\s([\s\S]*?)endobj/g)) objects.set(match[1], match[2]);

  const fontMaps = new Map<string, Map<number, string>>();
  for (const [id, body] of objects) {
    const toUnicode = /\/ToUnicode (\d+) 0 R/.exec(body);
    if (toUnicode) fontMaps.set(id, parseCMap(objects.get(toUnicode[1]) ?? ''));
  }
  const fontByName = new Map<string, Map<number, string>>();
  for (const body of objects.values()) {
    for (const match of body.matchAll(/\/(F\d+) (\d+) 0 R/g)) {
      const map = fontMaps.get(match[2]);
      if (map) fontByName.set(match[1], map);
    }
  }

  const pieces: string[] = [];
  for (const body of objects.values()) {
    const stream = /stream\r?\n([\s\S]*?)endstream/.exec(body)?.[1];
    if (!stream || !stream.includes(' Tf')) continue;
    let map: Map<number, string> | undefined;
    for (const match of stream.matchAll(/\/(F\d+) [\d.]+ Tf|\[([^\]]*)\] TJ/g)) {
      if (match[1]) map = fontByName.get(match[1]);
      else if (map) {
        const glyphs = [...match[2].matchAll(/<([0-9a-fA-F]+)>/g)].map((hex) => hex[1]).join('');
        let text = '';
        for (let i = 0; i < glyphs.length; i += 4) text += map.get(parseInt(glyphs.slice(i, i + 4), 16)) ?? '\uFFFD';
        pieces.push(text);
      }
    }
  }
  return pieces.join('\n');
}

function parseCMap(body: string): Map<number, string> {
  const map = new Map<number, string>();
  // A ligature maps to several characters: <0066 0069> is "fi".
  const unicode = (hex: string) => String.fromCharCode(...(hex.replace(/\s+/g, '').match(/.{4}/g) ?? []).map((unit) => parseInt(unit, 16)));
  for (const block of body.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const entry of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*\[([^\]]*)\]/g)) {
      const start = parseInt(entry[1], 16);
      [...entry[3].matchAll(/<([0-9a-fA-F\s]+)>/g)].forEach((hex, i) => map.set(start + i, unicode(hex[1])));
    }
  }
  for (const block of body.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const entry of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>/g)) map.set(parseInt(entry[1], 16), unicode(entry[2]));
  }
  return map;
}

/** Text without any white space, so a sentence wrapped over lines or split into font runs still matches. */
export const squeeze = (text: string) => text.replace(/\s+/g, '');
