import coreWebVitals from 'eslint-config-next/core-web-vitals';
import typescript from 'eslint-config-next/typescript';

const config = [
  {
    ignores: [
      '.next/**',
      'out-headers/**',
      'public/sw.js',
      'out/**',
      'dist/**',
      'next-env.d.ts',
      'test-results/**',
      'playwright-report/**',
      'bench-results/**',
      'node_modules/**',
    ],
  },
  ...coreWebVitals,
  ...typescript,
  {
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    // The engine is pure: nothing in lib/ may reach for React, Next or the DOM.
    files: ['lib/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['react', 'react-dom', 'react/*', 'next', 'next/*', 'recharts'], message: 'lib/ is a pure engine: no React, Next or chart code.' },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'navigator', 'localStorage'],
    },
  },
];

export default config;
