/**
 * The description of an ICC profile (its 'desc' tag), for showing which profile a photo carried.
 * Reads the two encodings in use: textDescriptionType ('desc', ICC v2) and multiLocalizedUnicodeType
 * ('mluc', ICC v4; the first record is taken). Layout per ICC.1:2010 §7.3 (header and tag table),
 * §10.13 (mluc); v2 'desc' per ICC.1:2001-04 §6.5.17. Returns null for anything it cannot read.
 */
export function iccDescription(icc: Buffer | undefined): string | null {
  if (!icc || icc.length < 132) return null;
  try {
    const count = icc.readUInt32BE(128);
    if (count > 200 || 132 + count * 12 > icc.length) return null;
    for (let i = 0; i < count; i++) {
      const o = 132 + i * 12;
      if (icc.toString('latin1', o, o + 4) !== 'desc') continue;
      const at = icc.readUInt32BE(o + 4);
      const size = icc.readUInt32BE(o + 8);
      if (at + size > icc.length || size < 12) return null;
      const type = icc.toString('latin1', at, at + 4);
      if (type === 'desc') {
        const n = icc.readUInt32BE(at + 8);
        return clean(icc.toString('latin1', at + 12, Math.min(at + 12 + n, at + size)));
      }
      if (type === 'mluc') {
        const records = icc.readUInt32BE(at + 8);
        if (records < 1) return null;
        const len = icc.readUInt32BE(at + 20);
        const off = icc.readUInt32BE(at + 24);
        if (off + len > size) return null;
        const utf16be = icc.subarray(at + off, at + off + len);
        const chars: number[] = [];
        for (let k = 0; k + 1 < utf16be.length; k += 2) chars.push(utf16be.readUInt16BE(k));
        return clean(String.fromCharCode(...chars));
      }
      return null;
    }
    return null;
  } catch {
    return null;
  }
}

function clean(s: string): string | null {
  const t = s.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, 200);
  return t || null;
}
