// ESLint for the whole tree (npm run lint; npm test runs it before the suites).
// Errors are the rules that catch real bugs: hooks called out of order or with
// missing dependencies, unused variables, promises nobody awaits or handles.
// Type-aware (the project service reads tsconfig.json): about 25 s on 2 cores.
import js from '@eslint/js';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['node_modules/', 'dist/', 'artifacts/', '.data/', '.expo/', 'expo-env.d.ts', 'docs/bench/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      '@typescript-eslint/no-floating-promises': 'error',
      // Metro bundles fonts and images through require(); everything else imports.
      '@typescript-eslint/no-require-imports': ['error', { allow: ['\\.(ttf|otf|png|jpg)$'] }],
    },
  },
  {
    // The hooks rules apply where React runs; server and test helpers may name functions use*.
    files: ['app/**/*.{ts,tsx}', 'src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    // Metro's config is CommonJS run by Node.
    files: ['**/*.js', '**/*.cjs'],
    languageOptions: { sourceType: 'commonjs', globals: { require: 'readonly', module: 'writable', __dirname: 'readonly' } },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
);
