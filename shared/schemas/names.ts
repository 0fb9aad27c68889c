/**
 * Names people give things (productions, looks, swatches, boards, curves, photos, lamps, members): text
 * that is shown to others, so it may not hide what it says. Refused: control characters (C0, DEL, C1, and
 * the line and paragraph separators), the bidirectional formatting characters of Unicode's bidi algorithm
 * (UAX #9 §2: LRE, RLE, PDF, LRO, RLO U+202A–U+202E; LRI, RLI, FSI, PDI U+2066–U+2069; the marks LRM, RLM
 * U+200E/U+200F and ALM U+061C — the "Trojan Source" reordering, CVE-2021-42574) and zero-width characters
 * (U+200B–U+200D, U+2060, U+FEFF). The two joiners U+200C/U+200D are kept where writing needs them (RFC 5892
 * appendix A.1/A.2 in spirit, simplified: between two letters or marks of a script that joins, such as
 * Persian or Devanagari, and ZWJ inside an emoji sequence), never between Latin, Greek or Cyrillic letters
 * where they only make look-alikes.
 */
import { z } from 'zod';
import './messages';

/** Control characters: C0, DEL, C1, LINE SEPARATOR, PARAGRAPH SEPARATOR. */
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/u;
/** Bidi formatting characters (UAX #9) and zero-width characters; the joiners are checked in context. */
const INVISIBLE = /[\u061c\u200b-\u200f\u202a-\u202e\u2060-\u2064\u2066-\u2069\ufeff]/u;
/** Letters and marks of scripts where a joiner changes nothing but the look: a joiner there is a disguise. */
const NON_JOINING = /[\p{Script=Latin}\p{Script=Greek}\p{Script=Cyrillic}\p{Script=Common}\p{Script=Inherited}]/u;
const LETTER_OR_MARK = /[\p{L}\p{M}]/u;
const PICTOGRAPH = /^(?:\p{Extended_Pictographic}|[\u{1F3FB}-\u{1F3FF}]|\ufe0f)$/u;

const codePoint = (ch: string) => `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;

/** Whether the joiner at `i` (U+200C or U+200D) sits where a script needs it. */
function joinerInContext(chars: string[], i: number): boolean {
  const before = chars[i - 1] ?? '';
  const after = chars[i + 1] ?? '';
  if (chars[i] === '\u200d' && PICTOGRAPH.test(before) && PICTOGRAPH.test(after)) return true;
  const joins = (c: string) => LETTER_OR_MARK.test(c) && !NON_JOINING.test(c);
  return joins(before) && joins(after);
}

/**
 * The first character a name may not hold, as a plain sentence naming its code point, or null when the
 * text is clean. Exported for the places that clean a name taken from elsewhere (an upload's file name).
 */
export function nameProblem(text: string): string | null {
  const chars = [...text];
  for (let i = 0; i < chars.length; i++) {
    const ch = chars[i];
    if (CONTROL.test(ch)) return `Names cannot contain control characters such as line breaks or tabs (${codePoint(ch)}).`;
    if (INVISIBLE.test(ch)) {
      if ((ch === '\u200c' || ch === '\u200d') && joinerInContext(chars, i)) continue;
      return `Names cannot contain invisible or direction-changing characters (${codePoint(ch)}).`;
    }
  }
  return null;
}

/** A name with the refused characters taken out (for names made from outside text, never for a person's input). */
export function cleanName(text: string): string {
  const chars = [...text];
  return chars
    .map((ch, i) => (CONTROL.test(ch) ? ' ' : INVISIBLE.test(ch) && !((ch === '\u200c' || ch === '\u200d') && joinerInContext(chars, i)) ? '' : ch))
    .join('')
    .replace(/\s+/g, ' ')
    .trim();
}

/**
 * A name field: trimmed, 1..max characters, no control, bidi-formatting or zero-width characters
 * (400 "Names cannot contain invisible or direction-changing characters (U+202E)."). `empty` is the
 * message for a blank one (default "Give a name.").
 */
export function nameText(max: number, opts: { empty?: string } = {}) {
  return z
    .string()
    .trim()
    .min(1, opts.empty ?? 'Give a name.')
    .max(max, `A name takes at most ${max} characters.`)
    .superRefine((v, ctx) => {
      const problem = nameProblem(v);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    });
}

/** Text that names something but may be empty or missing (a file name): the same characters refused. */
export function optionalNameText(max: number) {
  return z
    .string()
    .trim()
    .max(max, `A name takes at most ${max} characters.`)
    .superRefine((v, ctx) => {
      const problem = nameProblem(v);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    });
}
