/**
 * The text a person typed mid-shift → the text the command language reads. Applied once, before
 * tokens, by `handle`:
 *
 *   look-alike characters  Ω (ohm sign) → Ω, µ/μ → µ, ∙ ⋅ → ·, ◻ → □, non-breaking spaces → space,
 *                          zero-width characters dropped, curly quotes → straight
 *   chat markup            *bold*, _italic_, `code`, ~strike~ around words dropped
 *   framing                "what is", "what's", "convert", "calculate", "please"… in front and
 *                          "?", "!", "." at the end are not part of the command
 *   "@ 25C", "@25 °C"      → "at 25C"
 *   decimal commas         "8,2" → 8.2 and "1,5e15" → 1.5e15 (said in the reply); "1,500" could be
 *                          1.5 or 1500, so it is asked; "1,234,567" is a thousands separator
 *
 * Returns the text, notes for the reply's assumptions, and a question when a number has two
 * readings.
 */

export interface NumberQuestion {
  readonly question: string;
  readonly choices: readonly { readonly label: string; readonly answer: string; readonly text: string }[];
}

export interface Phrasing {
  readonly text: string;
  readonly notes: readonly string[];
  readonly question?: NumberQuestion;
}

const LOOK_ALIKES: readonly (readonly [RegExp, string])[] = [
  [/\u2126/g, 'Ω'], // OHM SIGN → GREEK CAPITAL OMEGA
  [/\u03bc/g, 'µ'], // GREEK SMALL MU → MICRO SIGN
  [/[\u2219\u22c5\u2027]/g, '·'],
  [/[\u25fb\u25a2\u2610]/g, '□'],
  [/[\u00a0\u2007\u202f\u2009\u200a\u3000]/g, ' '],
  [/[\u200b\u200c\u200d\u2060\ufeff]/g, ''],
  [/[\u2018\u2019\u201b]/g, "'"],
  [/[\u201c\u201d]/g, '"'],
  [/\uff1d/g, '='],
  [/[\u2014\u2212]/g, '-'],
];

/** Leading phrases that frame a question but are not part of the command. */
const FRAMING =
  /^(?:(?:hey|hi|hello|ok|okay|so|please|pls|quick(?:\s+one)?|q)[,:]?\s+|(?:can|could|would)\s+you\s+(?:please\s+)?|what(?:'s|s| is| are| does| do)?\s+(?:the\s+)?|what\s+would\s+(?:be\s+)?(?:the\s+)?|how\s+(?:much|many)\s+(?:is\s+)?|convert(?:\s+from)?\s+|calc(?:ulate)?\s+|compute\s+|give\s+me\s+(?:the\s+)?|tell\s+me\s+(?:the\s+)?|show\s+me\s+(?:the\s+)?|check\s+(?:a\s+|the\s+)?)/i;

/** Chat markup around a word: *bold*, _italic_, `code`, ~strike~ (not "ohm*cm" or "n_i"). */
const MARKUP = /(^|\s)[*_~`]+|[*_~`]+(?=\s|$)|```/g;

export function preparePhrasing(input: string): Phrasing {
  const notes: string[] = [];
  let text = input;
  for (const [from, to] of LOOK_ALIKES) text = text.replace(from, to);
  text = text.replace(MARKUP, '$1').trim();
  // Framing words in front, possibly several ("hey, what is …").
  for (let i = 0; i < 4; i++) {
    const m = FRAMING.exec(text);
    if (!m || m[0].length === text.length) break;
    text = text.slice(m[0].length).trimStart();
  }
  // Trailing question marks and full stops; a number's own point ("8.") is left alone.
  text = text.replace(/\s*[?!]+\s*$/, '').replace(/(?<=[A-Za-z°□)\]])\.+$/, '').trim();
  // "@ 25C", "@25 °C" → "at 25C"
  text = text.replace(/(^|\s)@\s*(?=[-+−]?\d)/g, '$1at ');
  // "what type is hot probe …", "hall coefficient is …": a lone "is" carries nothing (free text after
  // "because" is kept as typed).
  const [head, ...reason] = text.split(/(?=\bbecause\b)/i);
  text = [head!.replace(/(^|\s)is(?=\s|$)/gi, '$1').replace(/\s{2,}/g, ' ').trim(), ...reason].join(' ').trim();
  if (text === '' && /^\s*\?+\s*$/.test(input)) text = 'help';

  // Thousands separators in groups of three, more than one group: 1,234,567.
  text = text.replace(/(?<![\d.,])(\d{1,3}(?:,\d{3}){2,})(?![\d,.])/g, (m) => {
    notes.push(`"${m}" read as ${m.replace(/,/g, '')} (commas as thousands separators).`);
    return m.replace(/,/g, '');
  });
  let question: NumberQuestion | undefined;
  text = text.replace(/(?<![\d.,])([-+]?\d+),(\d+)(?![\d,])(e[-+]?\d+)?/gi, (m, whole: string, frac: string, exp: string | undefined) => {
    if (frac.length === 3 && !exp && !/^[-+]?0/.test(whole)) {
      // "1,500": a decimal comma (1.5) or a thousands separator (1500)?
      const asDecimal = `${whole}.${frac}`;
      const asThousands = `${whole}${frac}`;
      question ??= {
        question: `"${m}": ${asDecimal} or ${asThousands}? Answer \`${asDecimal}\` or \`${asThousands}\`.`,
        choices: [
          { label: `${asDecimal} (decimal comma)`, answer: asDecimal, text: '' },
          { label: `${asThousands} (thousands separator)`, answer: asThousands, text: '' },
        ],
      };
      return m;
    }
    const read = `${whole}.${frac}${exp ?? ''}`;
    notes.push(`"${m}" read as ${read} (decimal comma).`);
    return read;
  });
  if (question) {
    const q: NumberQuestion = question;
    const target = q.choices[0]!.answer.replace('.', ',');
    question = {
      question: q.question,
      choices: q.choices.map((c) => ({ ...c, text: text.replace(target, c.answer) })),
    };
  }
  return { text, notes, ...(question ? { question } : {}) };
}
