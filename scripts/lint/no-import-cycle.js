/**
 * ESLint rule `local/no-import-cycle`: reports an import whose target leads back, through any chain of
 * relative imports, to the importing file. Unlike eslint-plugin-import-x's `no-cycle`, type-only imports
 * count (see import-graph.js for why).
 */
import path from 'node:path';
import { pathBack, resolveImport } from './import-graph.js';

/** @type {import('eslint').Rule.RuleModule} */
export const noImportCycle = {
  meta: {
    type: 'problem',
    docs: { description: 'Forbid import cycles between our source files, type-only imports included' },
    messages: { cycle: 'Import cycle: {{chain}}' },
    schema: [],
  },
  create(context) {
    const file = context.filename;
    const check = (node, source) => {
      if (!source || typeof source.value !== 'string') return;
      const target = resolveImport(file, source.value);
      if (!target) return;
      const back = target === file ? [] : pathBack(target, file);
      if (!back) return;
      const cwd = context.cwd;
      const chain = [file, target, ...back, file].map((f) => path.relative(cwd, f)).join(' -> ');
      context.report({ node: source, messageId: 'cycle', data: { chain } });
    };
    return {
      ImportDeclaration: (node) => check(node, node.source),
      ExportNamedDeclaration: (node) => check(node, node.source),
      ExportAllDeclaration: (node) => check(node, node.source),
      ImportExpression: (node) => check(node, node.source),
    };
  },
};

export default { rules: { 'no-import-cycle': noImportCycle } };
