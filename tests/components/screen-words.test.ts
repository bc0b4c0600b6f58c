import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { borrowedWordsIn } from '@/tests/shared/helpers/borrowed-words';

const root = path.resolve(__dirname, '..', '..');

function sourceFiles(folder: string): string[] {
  return fs.readdirSync(path.join(root, folder), { withFileTypes: true }).flatMap((entry) => {
    const relative = path.join(folder, entry.name);
    if (entry.isDirectory()) return sourceFiles(relative);
    return /\.tsx?$/.test(entry.name) ? [relative] : [];
  });
}

/** The text a source can put on screen: its string literals, template text and JSX text, never its imports or comments. */
function shownText(file: string, content = fs.readFileSync(path.join(root, file), 'utf8')): string[] {
  const source = ts.createSourceFile(file, content, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  const texts: string[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) return;
    if (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node) || ts.isJsxText(node)) texts.push(node.text);
    if (ts.isTemplateExpression(node)) texts.push(node.head.text, ...node.templateSpans.map((span) => span.literal.text));
    ts.forEachChild(node, visit);
  };
  visit(source);
  return texts.map((text) => text.trim()).filter((text) => text !== '');
}

describe('text on screen', () => {
  const files = [...sourceFiles('app'), ...sourceFiles('components')];

  it('reads every screen and route file', () => {
    expect(files).toEqual(expect.arrayContaining(['components/sizing/sandbox-screen.tsx', path.join('app', '(app)', 'sandbox.tsx')]));
  });

  it('names no library and no engine error word', () => {
    const offending = files.flatMap((file) =>
      shownText(file).flatMap((text) => borrowedWordsIn(text).map((word) => `${file}: ${word} in "${text}"`)),
    );
    expect(offending).toEqual([]);
  });

  it('finds borrowed words in JSX text and templates, and none in imports or comments', () => {
    const screen = [
      "import { create } from 'mathjs';",
      '// Units as mathjs reads them.',
      'export const Cell = ({ key }: { key: string }) => <AppText title={`${key}: #VALUE!`}>Units in HyperFormula syntax</AppText>;',
    ].join('\n');
    expect(shownText('screen.tsx', screen).flatMap(borrowedWordsIn)).toHaveLength(2);
  });
});
