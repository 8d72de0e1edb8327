import js from '@eslint/js';
import globals from 'globals';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  {
    ignores: [
      '**/dist/**',
      '**/node_modules/**',
      '.data/**',
      '.test-data/**',
      'artifacts/**',
      '.dev-data/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    // Features do not import each other; routes in src/app compose them (bulletproof-react).
    files: ['packages/web/src/features/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              // Paths that climb out of src/features entirely (e.g. to another package's test helpers) are allowed.
              group: ['../../*/**', '!../../../**', '../../../features/**', '@/features/*'],
              message: 'Features must not import other features; compose them in src/app.',
            },
          ],
        },
      ],
    },
  },
);
