import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

// The model in src/ must run in plain Node: no React, DOM, zustand or
// d3-selection, and nothing from app/. ESLint enforces the same rule while
// editing; this test enforces it in CI whatever the editor does.
const SRC = join(import.meta.dirname, '..', 'src');
const FORBIDDEN = /^(react|react-dom|zustand|d3|d3-selection|d3-drag|d3-zoom|d3-transition)(\/|$)|(^|\/)app(\/|$)/;
const DOM_GLOBALS = /\b(document|window|localStorage|navigator|HTMLElement|requestAnimationFrame)\b/;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : path.endsWith('.ts') ? [path] : [];
  });
}

function importsOf(text: string): string[] {
  const specs: string[] = [];
  for (const m of text.matchAll(/(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|require\(\s*['"]([^'"]+)['"]\s*\)/g)) {
    specs.push((m[1] ?? m[2] ?? m[3]) as string);
  }
  return specs;
}

describe('src/ stays a pure model', () => {
  const files = sourceFiles(SRC);

  it('has model files to check', () => {
    expect(files.length).toBeGreaterThan(10);
  });

  it.each(files.map((f) => [relative(SRC, f), f]))('%s imports no UI, DOM or app code', (_name, file) => {
    const text = readFileSync(file as string, 'utf8');
    const bad = importsOf(text).filter((spec) => FORBIDDEN.test(spec.replace(/^(\.\.\/)+/, '')) || spec.includes('/app/'));
    expect(bad).toEqual([]);
    const code = text.replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
    expect(code.match(DOM_GLOBALS)?.[0] ?? null).toBeNull();
  });

  it('the import check recognises a forbidden import (guards the guard)', () => {
    const specs = importsOf("import { create } from 'zustand';\nimport x from '../../app/store';\nconst r = await import('react');");
    expect(specs).toEqual(['zustand', '../../app/store', 'react']);
    expect(specs.every((s) => FORBIDDEN.test(s.replace(/^(\.\.\/)+/, '')))).toBe(true);
  });
});
