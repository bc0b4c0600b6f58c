/**
 * Words that must never reach people: the names of the libraries Trimsheet is built on, and the raw words
 * of its engines' errors (a grid engine's error values and messages, a unit library's messages). Text shown
 * to people says what is wrong in our own words.
 */
const borrowedWords: readonly RegExp[] = [
  // Libraries.
  /\bmath\.?js\b/i,
  /\bhyperformula\b/i,
  /\bexceljs\b/i,
  /\bpdfkit\b/i,
  /\bpdf-parse\b/i,
  /\bconvert-units\b/i,
  /\bsequelize\b/i,
  /\bzod\b/i,
  /\bd3\b/i,
  /\byauzl\b/i,
  /\bmulter\b/i,
  /\bnodemailer\b/i,
  // A grid engine's error values and kinds.
  /#(?:NAME\?|VALUE!|REF!|DIV\/0!|N\/A|NUM!|NULL!|ERROR!|CYCLE!|SPILL!|LIC!)/,
  /\b(?:DIV_BY_ZERO|SPILL|LIC)\b/,
  /cannot be coerced/i,
  /Wrong (?:type|number) of arguments?/,
  /Parsing error/,
  /Cell reference expected|Address is not correct|Cell range/,
  /NaN or infinite value encountered/,
  // A unit library's messages.
  /Undefined symbol/i,
  /Unit "[^"]*" not found/i,
  /\bat index \d+/,
  /Could not parse/,
  /contains no units/,
  /Trailing characters/,
  /\b(?:SyntaxError|TypeError|RangeError)\b/,
  // Other programs' grid addresses.
  /\bA1\b|\bR1C1\b/,
];

/** The borrowed words (as their patterns) found in `text`; empty when it is all our own. */
export function borrowedWordsIn(text: string): string[] {
  return borrowedWords.filter((pattern) => pattern.test(text)).map((pattern) => pattern.source);
}
