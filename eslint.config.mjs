import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    rules: {
      // A leading underscore marks a binding left unused on purpose (a key dropped by rest destructuring).
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' },
      ],
      // A notice for the React Compiler, which this project does not run (no reactCompiler in next.config.mjs).
      'react-hooks/incompatible-library': 'off',
    },
  },
  {
    // Migrations and seeders are CommonJS because sequelize-cli loads them with require().
    files: ['migrations/**/*.js', 'seeders/**/*.js'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    // Pages are server components rendered once per request: reading the clock there is intended.
    files: ['app/**/page.tsx'],
    rules: { 'react-hooks/purity': 'off' },
  },
  {
    // Photos come from /api/photos, which checks the viewer's cookie; next/image's optimizer would fetch them without it.
    files: ['components/practicals/photo-uploader.tsx', 'components/practicals/practical-history.tsx', 'components/tasting-table/photo-viewer.tsx'],
    rules: { '@next/next/no-img-element': 'off' },
  },
  globalIgnores(['.next/**', '.next-*/**', '.data/**', 'out/**', 'coverage/**', 'bench-results/**', 'test-results/**', 'next-env.d.ts']),
]);
