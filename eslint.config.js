import tseslint from 'typescript-eslint';

// The one architectural rule the compiler cannot see: the model in src/ is pure
// TypeScript that runs in Node. It must not reach into the UI or the DOM layer.
export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'bench/results.json', '.scratch/**', 'test-results/**'] },
  ...tseslint.configs.recommended,
  {
    files: ['src/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['react', 'react-dom', 'react/*', 'react-dom/*'], message: 'src/ is the pure model: no React.' },
            { group: ['zustand', 'zustand/*'], message: 'src/ is the pure model: state lives in app/store.' },
            { group: ['d3-selection', 'd3-drag', 'd3-zoom', 'd3', 'd3-transition'], message: 'src/ is the pure model: drawing lives in app/ui.' },
            { group: ['**/app/**', '../app', '../../app'], message: 'Dependencies point one way: app imports src, never the reverse.' },
          ],
        },
      ],
    },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
);
