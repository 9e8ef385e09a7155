// Flat config: typescript-eslint for .ts, eslint-plugin-vue for .vue, Prettier owns formatting.
import js from '@eslint/js'
import tseslint from 'typescript-eslint'
import pluginVue from 'eslint-plugin-vue'
import prettier from 'eslint-config-prettier'
import globals from 'globals'

const restrict = (files, patterns) => ({
  files,
  rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns }] },
})
const noTests = { group: ['**/tests/**'], message: 'Nothing imports from tests/.' }
const boundaries = [
  restrict(
    ['orient/**/*.ts'],
    [
      {
        group: ['**/backend/**', '**/frontend/**', '**/schema/**', '**/tests/**'],
        message: 'orient/ is pure mathematics: it imports nothing of ours.',
      },
    ],
  ),
  restrict(
    ['schema/**/*.ts'],
    [
      {
        group: ['**/backend/**', '**/frontend/**', '**/orient/**'],
        message: 'schema/ holds tables and request shapes only.',
      },
      noTests,
    ],
  ),
  restrict(
    ['backend/**/*.ts'],
    [{ group: ['**/frontend/**'], message: 'The server never imports the browser app.' }, noTests],
  ),
  restrict(
    ['backend/src/routes/**/*.ts'],
    [
      {
        group: ['**/db/*', '!**/db/client'],
        message: 'Routes stay thin: they call a service, never the database.',
      },
      {
        group: ['**/db/client'],
        importNames: ['createDb'],
        message: 'Routes stay thin: they call a service, never the database.',
      },
      { group: ['drizzle-orm', 'drizzle-orm/*'], message: 'Routes never query: call a service.' },
      { group: ['**/backend/**', '**/frontend/**'], message: 'Wrong layer.' },
      noTests,
    ],
  ),
  restrict(
    ['backend/src/services/**/*.ts'],
    [
      {
        group: ['**/routes/**', '**/auth/guards', '**/http/validate'],
        message: 'Services never see HTTP: the role ladder is in schema/vocabulary.ts.',
      },
      { group: ['**/frontend/**'], message: 'Wrong layer.' },
      noTests,
    ],
  ),
  restrict(
    ['frontend/**/*.ts', 'frontend/**/*.vue'],
    [
      { group: ['**/backend/**'], message: 'The browser app never imports the server.' },
      {
        group: ['**/schema/*', '!**/schema/vocabulary'],
        allowTypeImports: true,
        message: 'Only types come from schema/ (and runtime words from schema/vocabulary.ts).',
      },
      noTests,
    ],
  ),
  restrict(
    ['frontend/src/components/**/*.ts', 'frontend/src/components/**/*.vue'],
    [
      {
        group: ['**/api/*', '!**/api/types', '!**/api/interval-types'],
        allowTypeImports: true,
        message: 'Components never fetch: a composable calls api/ and hands them the data.',
      },
      { group: ['**/backend/**'], message: 'Wrong layer.' },
      {
        group: ['**/schema/*', '!**/schema/vocabulary'],
        allowTypeImports: true,
        message: 'Only types come from schema/.',
      },
      noTests,
    ],
  ),
  restrict(
    ['frontend/src/composables/**/*.ts'],
    [
      { group: ['*.vue', '**/*.vue'], message: 'Composables import no components.' },
      { group: ['**/backend/**'], message: 'Wrong layer.' },
      {
        group: ['**/schema/*', '!**/schema/vocabulary'],
        allowTypeImports: true,
        message: 'Only types come from schema/.',
      },
      noTests,
    ],
  ),
  restrict(
    ['frontend/src/logic/**/*.ts'],
    [
      {
        group: ['**/components/**', '**/composables/**', '**/views/**', '*.vue', '**/*.vue'],
        message: 'logic/ is plain TypeScript: it imports no components, composables or views.',
      },
      { group: ['**/backend/**'], message: 'Wrong layer.' },
      {
        group: ['**/schema/*', '!**/schema/vocabulary'],
        allowTypeImports: true,
        message: 'Only types come from schema/.',
      },
      noTests,
    ],
  ),
]

export default tseslint.config(
  {
    ignores: [
      'node_modules/**',
      'frontend/dist/**',
      '.data/**',
      'tests/artifacts/**',
      'schema/migrations/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
      'vue/multi-word-component-names': ['error', { ignores: ['App'] }],
    },
  },
  // The direction of dependencies (DEVELOPERS.md): each rule names the layer it keeps apart.
  ...boundaries,
  prettier,
)
