/**
 * Validation messages in plain words, for every schema that does not carry its own: "RGB values go from
 * 0 to 255.", "Give a name.", "Coverage goes from 0 to 1." instead of the schema library's wording
 * ("Too big: expected number to be <=255"). Installed once with zod's global error map (`z.config`), on
 * import of this file: the server's validate() imports it, and so do the shared schemas, so a form on the
 * client that parses with them says the same words. Messages given on a schema itself win over these.
 */
import { z } from 'zod';

/** How a field is called in a message, by its key (the last non-index part of the path). */
const LABELS: Record<string, { label: string; plural?: boolean }> = {
  name: { label: 'name' },
  email: { label: 'e-mail address' },
  rgb: { label: 'RGB values', plural: true },
  lab: { label: 'L*a*b* values', plural: true },
  hex: { label: 'colour' },
  srgb: { label: 'colour' },
  coverage: { label: 'coverage' },
  melanin: { label: 'melanin' },
  pheomelanin: { label: 'pheomelanin' },
  blood: { label: 'blood' },
  oxygenation: { label: 'oxygenation' },
  bilirubin: { label: 'bilirubin' },
  carotene: { label: 'carotene' },
  lightStops: { label: 'the light on the surface' },
  mergeStops: { label: 'the merge threshold' },
  mergeDeltaE: { label: 'the colour difference threshold' },
  department: { label: 'department' },
  role: { label: 'role' },
  notes: { label: 'notes', plural: true },
  description: { label: 'description' },
  password: { label: 'password' },
  type: { label: 'type' },
};

/** Words of a camelCase key: `keyZone` → "key zone". */
const words = (key: string) => key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[_-]+/g, ' ').toLowerCase();
const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The field's label and whether it reads as plural ("RGB values go …"), from an issue's path. */
export function fieldLabel(path: readonly PropertyKey[] | undefined): { label: string; plural: boolean } {
  const key = [...(path ?? [])].reverse().find((p): p is string => typeof p === 'string');
  if (!key) return { label: 'this value', plural: false };
  const known = LABELS[key];
  return known ? { label: known.label, plural: !!known.plural } : { label: words(key), plural: false };
}

/** What a missing or empty field asks for: "Give a name.", "Give the coverage." */
const give = (label: string) => (label === 'name' ? 'Give a name.' : `Give ${label.startsWith('the ') ? label : `the ${label}`}.`);

const num = (v: unknown) => (typeof v === 'bigint' ? v.toString() : String(v));

/** What zod calls a type, as a person would say it. */
const TYPE_WORDS: Record<string, string> = {
  number: 'a number',
  int: 'a whole number',
  string: 'text',
  boolean: 'yes or no (true or false)',
  array: 'a list',
  tuple: 'a list',
  object: 'a group of fields',
  date: 'a date',
};

/** Bounds of the number schema an issue came from, when it has both (zod 4 keeps them on the schema). */
function boundsOf(issue: { schema?: unknown }): [number, number] | null {
  const s = issue.schema as { minValue?: number | null; maxValue?: number | null } | undefined;
  const lo = s?.minValue;
  const hi = s?.maxValue;
  return typeof lo === 'number' && typeof hi === 'number' && Number.isFinite(lo) && Number.isFinite(hi) ? [lo, hi] : null;
}

type RawIssue = Parameters<NonNullable<NonNullable<Parameters<typeof z.config>[0]>['customError']>>[0];

/**
 * A plain message for a zod issue that has none of its own, naming the field in words (the error
 * response names the field path beside it). Undefined leaves zod's own message (never reached in practice).
 */
export function plainMessage(issue: RawIssue): string | undefined {
  const { label, plural } = fieldLabel(issue.path);
  const Label = cap(label);
  const is = plural ? 'are' : 'is';
  const go = plural ? 'go' : 'goes';
  switch (issue.code) {
    case 'invalid_type': {
      if (issue.input === undefined) return give(label);
      const expected = String((issue as { expected?: string }).expected ?? '');
      return `${Label} should be ${TYPE_WORDS[expected] ?? expected}.`;
    }
    case 'too_small':
    case 'too_big': {
      const origin = (issue as { origin?: string }).origin;
      if (origin === 'number' || origin === 'bigint') {
        const b = boundsOf(issue as { schema?: unknown });
        if (b) return `${Label} ${go} from ${b[0]} to ${b[1]}.`;
        const limit = issue.code === 'too_small' ? (issue as { minimum?: unknown }).minimum : (issue as { maximum?: unknown }).maximum;
        const inclusive = (issue as { inclusive?: boolean }).inclusive !== false;
        if (issue.code === 'too_small') return `${Label} ${plural ? 'have' : 'has'} to be ${inclusive ? 'at least' : 'more than'} ${num(limit)}.`;
        return `${Label} ${plural ? 'have' : 'has'} to be ${inclusive ? 'at most' : 'less than'} ${num(limit)}.`;
      }
      if (origin === 'string') {
        if (issue.code === 'too_small') return Number((issue as { minimum?: unknown }).minimum) <= 1 ? give(label) : `${Label} needs at least ${num((issue as { minimum?: unknown }).minimum)} characters.`;
        return `${Label} takes at most ${num((issue as { maximum?: unknown }).maximum)} characters.`;
      }
      if (origin === 'array' || origin === 'set') {
        if (issue.code === 'too_small') return `${Label} needs at least ${num((issue as { minimum?: unknown }).minimum)} items.`;
        return `${Label} takes at most ${num((issue as { maximum?: unknown }).maximum)} items.`;
      }
      return `${Label} ${is} out of range.`;
    }
    case 'invalid_value': {
      const values = ((issue as { values?: unknown[] }).values ?? []).map(String);
      if (values.length === 1) return `${Label} has to be ${values[0]}.`;
      return `Choose the ${label.replace(/^the /, '')}: ${values.slice(0, -1).join(', ')} or ${values[values.length - 1]}.`;
    }
    case 'invalid_union': {
      const u = issue as { note?: string; options?: unknown[] };
      if (u.note === 'No matching discriminator' && u.options?.length) {
        const o = u.options.map(String);
        return `Choose the ${label.replace(/^the /, '')}: ${o.slice(0, -1).join(', ')} or ${o[o.length - 1]}.`;
      }
      return `${Label} is not in any of the accepted forms.`;
    }
    case 'invalid_format': {
      const format = (issue as { format?: string }).format;
      if (format === 'email') return 'Give an e-mail address like name@example.com.';
      return `${Label} is not in the right form.`;
    }
    case 'unrecognized_keys': {
      const keys = ((issue as { keys?: string[] }).keys ?? []).map((k) => `"${k}"`);
      return keys.length === 1 ? `There is no field ${keys[0]} here.` : `There are no fields ${keys.join(', ')} here.`;
    }
    case 'not_multiple_of':
      return `${Label} has to be a multiple of ${num((issue as { divisor?: unknown }).divisor)}.`;
    case 'invalid_key':
    case 'invalid_element':
      return `${Label} has a value that is not accepted.`;
    default:
      return undefined;
  }
}

z.config({ customError: (issue) => plainMessage(issue) });

/** Imported for its effect: the plain messages are installed (a no-op marker for readers and linters). */
export const PLAIN_MESSAGES = true;
