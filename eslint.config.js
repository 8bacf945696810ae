// Flat config: TypeScript everywhere, Angular's rules for the client and its templates.
const eslint = require('@eslint/js');
const tseslint = require('typescript-eslint');
const angular = require('angular-eslint');

// The engine's layers, lowest first: a folder may import its own and lower folders only, and
// nothing in the engine reaches outside server/src/thermo (packages such as fraction.js are fine).
// testing/ and bench/ sit on top; specs may use testing/.
const THERMO_LAYERS = [
  'errors',
  'rational',
  'formula',
  'equation',
  'balance',
  'enthalpy',
  'temperature',
];
const thermoLayerRules = THERMO_LAYERS.flatMap((layer, i) => {
  const higher = [...THERMO_LAYERS.slice(i + 1), 'testing', 'bench'];
  const rule = (forbidden) => ({
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          {
            regex: `^\\.\\./(${forbidden.join('|')})(/|$)`,
            message: `thermo/${layer} is a lower layer of the engine: it must not import from ${forbidden.join(', ')}.`,
          },
          {
            regex: '^\\.\\.(/index)?$|^\\.\\./\\.\\.(/|$)',
            message:
              'The engine imports nothing outside server/src/thermo, and layers never import its index.',
          },
        ],
      },
    ],
  });
  return [
    { files: [`server/src/thermo/${layer}/**/*.ts`], rules: rule(higher) },
    {
      files: [`server/src/thermo/${layer}/**/*.spec.ts`],
      rules: rule(higher.filter((h) => h !== 'testing')),
    },
  ];
});

module.exports = tseslint.config(
  {
    ignores: [
      'dist/',
      '.angular/',
      'node_modules/',
      'coverage/',
      'artifacts/',
      'schema/migrations/',
    ],
  },
  {
    files: ['**/*.ts'],
    extends: [eslint.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-non-null-assertion': 'off',
      'no-console': 'error',
    },
  },
  {
    files: ['client/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/prefer-on-push-component-change-detection': 'error',
      '@angular-eslint/prefer-inject': 'error',
      '@angular-eslint/prefer-signals': 'error',
      '@angular-eslint/component-selector': [
        'error',
        { type: 'element', prefix: 'thalpos', style: 'kebab-case' },
      ],
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'thalpos', style: 'camelCase' },
      ],
    },
  },
  {
    files: ['client/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
    rules: { '@angular-eslint/template/prefer-control-flow': 'error' },
  },
  {
    files: ['**/*.spec.ts', 'tests/**/*.ts'],
    rules: {
      '@typescript-eslint/no-explicit-any': 'off',
      // Test hosts are throwaway components.
      '@angular-eslint/prefer-on-push-component-change-detection': 'off',
    },
  },
  ...thermoLayerRules,
  {
    files: ['server/src/thermo/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^\\.\\.(/|$)',
              message: 'The engine imports nothing outside server/src/thermo.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/src/thermo/{testing,bench}/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^\\.\\./\\.\\.(/|$)',
              message: 'The engine imports nothing outside server/src/thermo.',
            },
          ],
        },
      ],
    },
  },
  {
    // Programs that report to a terminal: the benchmarks, and a failed client bootstrap.
    files: ['server/src/**/bench/**/*.ts', 'client/src/main.ts'],
    rules: { 'no-console': 'off' },
  },
);
