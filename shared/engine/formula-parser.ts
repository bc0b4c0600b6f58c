/**
 * Parser for sheet formulas in spreadsheet syntax ("=film_thickness * film_density * sail_area").
 * It follows HyperFormula's grammar and precedence (comparison < + - < * / < ^ < % < unary sign,
 * ^ left-associative), so that the tree it builds evaluates as HyperFormula would evaluate the text.
 * The tree drives dependency tracking, dimension checks, the cell formulas given to HyperFormula
 * and the compiled evaluator.
 */

export type BinaryOperator = '+' | '-' | '*' | '/' | '^' | '=' | '<>' | '<' | '>' | '<=' | '>=';

export type FormulaNode =
  | { readonly kind: 'number'; readonly value: number }
  | { readonly kind: 'ref'; readonly key: string }
  | { readonly kind: 'call'; readonly name: string; readonly args: readonly FormulaNode[] }
  | { readonly kind: 'unary'; readonly op: '+' | '-'; readonly operand: FormulaNode }
  | { readonly kind: 'percent'; readonly operand: FormulaNode }
  | { readonly kind: 'binary'; readonly op: BinaryOperator; readonly left: FormulaNode; readonly right: FormulaNode };

/** A formula that does not parse: the message says what was found and at which character. */
export class FormulaSyntaxError extends Error {}

type Token =
  | { kind: 'number'; value: number; at: number }
  | { kind: 'name'; text: string; at: number }
  | { kind: 'op'; text: string; at: number }
  | { kind: 'end'; at: number };

const OPERATORS = ['<=', '>=', '<>', '+', '-', '*', '/', '^', '%', '=', '<', '>', '(', ')', ','];

function tokenize(body: string, offset: number): Token[] {
  const tokens: Token[] = [];
  let index = 0;
  while (index < body.length) {
    const rest = body.slice(index);
    const space = /^\s+/.exec(rest);
    if (space !== null) {
      index += space[0].length;
      continue;
    }
    const at = index + offset;
    const number = /^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/.exec(rest);
    if (number !== null) {
      tokens.push({ kind: 'number', value: Number(number[0]), at });
      index += number[0].length;
      continue;
    }
    const name = /^[A-Za-z_][A-Za-z0-9_.]*/.exec(rest);
    if (name !== null) {
      tokens.push({ kind: 'name', text: name[0], at });
      index += name[0].length;
      continue;
    }
    const operator = OPERATORS.find((candidate) => rest.startsWith(candidate));
    if (operator === undefined) {
      const what = rest.startsWith('"') ? 'text values are not supported' : `unexpected "${rest.charAt(0)}"`;
      throw new FormulaSyntaxError(`${what} at character ${at + 1}`);
    }
    tokens.push({ kind: 'op', text: operator, at });
    index += operator.length;
  }
  tokens.push({ kind: 'end', at: body.length + offset });
  return tokens;
}

/** How tightly each binary operator binds (comparison < + - < * / < ^), as HyperFormula reads them. */
export const BINARY_PRECEDENCE: Readonly<Record<string, number>> = {
  '=': 1,
  '<>': 1,
  '<': 1,
  '>': 1,
  '<=': 1,
  '>=': 1,
  '+': 2,
  '-': 2,
  '*': 3,
  '/': 3,
  '^': 4,
};

function describeToken(token: Token): string {
  switch (token.kind) {
    case 'end':
      return 'end of formula';
    case 'number':
      return `number ${token.value}`;
    case 'name':
      return `"${token.text}"`;
    case 'op':
      return `"${token.text}"`;
  }
}

/**
 * How deep a formula may nest (brackets, calls, signs, and chains of operators). The engine walks formulas
 * recursively, so a formula far deeper than any sizing needs must be refused with a message, not overflow
 * the stack.
 */
const MAX_FORMULA_DEPTH = 64;

const tooDeep = () => new FormulaSyntaxError(`the formula nests deeper than ${MAX_FORMULA_DEPTH} levels; split it over several rows`);

/** How deep a parsed tree is, walked without recursion. */
function treeDepth(root: FormulaNode): number {
  let deepest = 0;
  const pending: [FormulaNode, number][] = [[root, 1]];
  for (let item = pending.pop(); item !== undefined; item = pending.pop()) {
    const [node, depth] = item;
    deepest = Math.max(deepest, depth);
    const children =
      node.kind === 'binary'
        ? [node.left, node.right]
        : node.kind === 'call'
          ? node.args
          : node.kind === 'unary' || node.kind === 'percent'
            ? [node.operand]
            : [];
    for (const child of children) pending.push([child, depth + 1]);
  }
  return deepest;
}

class Parser {
  private position = 0;
  private nesting = 0;

  constructor(private readonly tokens: readonly Token[]) {}

  /** Runs one level of the recursive descent, refusing a formula that nests too deep for it. */
  private nested<T>(parse: () => T): T {
    if (this.nesting >= MAX_FORMULA_DEPTH) throw tooDeep();
    this.nesting += 1;
    try {
      return parse();
    } finally {
      this.nesting -= 1;
    }
  }

  private peek(): Token {
    return this.tokens[this.position] ?? { kind: 'end', at: 0 };
  }

  private next(): Token {
    const token = this.peek();
    this.position += 1;
    return token;
  }

  private fail(token: Token, expected: string): never {
    throw new FormulaSyntaxError(`expected ${expected} but found ${describeToken(token)} at character ${token.at + 1}`);
  }

  private isOp(text: string): boolean {
    const token = this.peek();
    return token.kind === 'op' && token.text === text;
  }

  parseFormula(): FormulaNode {
    const node = this.parseBinary(1);
    const token = this.peek();
    if (token.kind !== 'end') this.fail(token, 'an operator or end of formula');
    // A long chain such as a+b+c+… is parsed in a loop but still gives a deep tree.
    if (treeDepth(node) > MAX_FORMULA_DEPTH) throw tooDeep();
    return node;
  }

  private parseBinary(minPrecedence: number): FormulaNode {
    return this.nested(() => this.parseBinaryLevel(minPrecedence));
  }

  private parseBinaryLevel(minPrecedence: number): FormulaNode {
    let left = this.parsePostfix();
    for (;;) {
      const token = this.peek();
      const precedence = token.kind === 'op' ? BINARY_PRECEDENCE[token.text] : undefined;
      if (token.kind !== 'op' || precedence === undefined || precedence < minPrecedence) return left;
      this.next();
      const right = this.parseBinary(precedence + 1);
      left = { kind: 'binary', op: token.text as BinaryOperator, left, right };
    }
  }

  private parsePostfix(): FormulaNode {
    let node = this.parseUnary();
    while (this.isOp('%')) {
      this.next();
      node = { kind: 'percent', operand: node };
    }
    return node;
  }

  private parseUnary(): FormulaNode {
    if (this.isOp('-') || this.isOp('+')) {
      const op = this.next();
      return { kind: 'unary', op: op.kind === 'op' && op.text === '-' ? '-' : '+', operand: this.nested(() => this.parseUnary()) };
    }
    return this.parsePrimary();
  }

  private parsePrimary(): FormulaNode {
    const token = this.next();
    if (token.kind === 'number') return { kind: 'number', value: token.value };
    if (token.kind === 'name') {
      if (!this.isOp('(')) return { kind: 'ref', key: token.text };
      this.next();
      return { kind: 'call', name: token.text.toUpperCase(), args: this.parseArguments() };
    }
    if (token.kind === 'op' && token.text === '(') {
      const inner = this.parseBinary(1);
      const close = this.next();
      if (close.kind !== 'op' || close.text !== ')') this.fail(close, '")"');
      return inner;
    }
    return this.fail(token, 'a number, a parameter key, a function or "("');
  }

  private parseArguments(): FormulaNode[] {
    const args: FormulaNode[] = [];
    if (this.isOp(')')) {
      this.next();
      return args;
    }
    for (;;) {
      args.push(this.parseBinary(1));
      const token = this.next();
      if (token.kind === 'op' && token.text === ')') return args;
      if (token.kind !== 'op' || token.text !== ',') this.fail(token, '"," or ")"');
    }
  }
}

/**
 * Parses a formula; it must start with "=". Throws FormulaSyntaxError naming the place of the error.
 */
export function parseFormula(formula: string): FormulaNode {
  const start = formula.indexOf('=');
  if (start < 0 || formula.slice(0, start).trim() !== '') {
    throw new FormulaSyntaxError('a formula must start with "="');
  }
  const body = formula.slice(start + 1);
  if (body.trim() === '') throw new FormulaSyntaxError('the formula is empty after "="');
  return new Parser(tokenize(body, start + 1)).parseFormula();
}

/** Every parameter key a formula refers to, once each, in order of appearance. */
export function referencedKeys(node: FormulaNode): string[] {
  const keys = new Set<string>();
  const visit = (current: FormulaNode): void => {
    switch (current.kind) {
      case 'ref':
        keys.add(current.key);
        return;
      case 'call':
        current.args.forEach(visit);
        return;
      case 'unary':
      case 'percent':
        visit(current.operand);
        return;
      case 'binary':
        visit(current.left);
        visit(current.right);
        return;
      case 'number':
        return;
    }
  };
  visit(node);
  return [...keys];
}
