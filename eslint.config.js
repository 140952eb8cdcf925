// `npm run lint`: the import boundaries of DEVELOPERS.md ("Imports"), kept by ESLint
// with eslint-plugin-boundaries, and Prettier's check of the layout (run beside it).
import boundaries from 'eslint-plugin-boundaries';
import tseslint from 'typescript-eslint';

const publicFile = '{index,*.service}.ts';
const sameOrPublic = (type) => [
  { to: { element: { type, captured: { name: '{{ from.element.captured.name }}' } } } },
  { to: { element: { type, fileInternalPath: publicFile } } },
];

export default [
  { ignores: ['node_modules/**', 'dist/**', '.data/**', 'coverage/**'] },
  {
    files: ['{src,server,shared}/**/*.{ts,tsx}'],
    languageOptions: { parser: tseslint.parser },
    plugins: { boundaries },
    settings: {
      'import/resolver': { typescript: { alwaysTryTypes: true } },
      'boundaries/legacy-templates': false,
      'boundaries/elements': [
        { type: 'shared', pattern: 'shared' },
        { type: 'client-app', pattern: 'src/app' },
        { type: 'client-feature', pattern: 'src/features/*', capture: ['name'] },
        { type: 'client-base', pattern: 'src/{components,lib,styles}' },
        { type: 'client-entry', pattern: 'src/{main.tsx,sw.ts}', mode: 'file' },
        { type: 'server-base', pattern: 'server/{db,http,documents}' },
        { type: 'server-base', pattern: 'server/config.ts', mode: 'file' },
        { type: 'server-root', pattern: 'server/{*.ts,seed/**}', mode: 'file' },
        { type: 'server-fakes', pattern: 'server/fakes' },
        { type: 'server-component', pattern: 'server/*', capture: ['name'] },
      ],
    },
    rules: {
      'boundaries/dependencies': [
        2,
        {
          default: 'disallow',
          policies: [
            // shared/ is pure: it imports only itself.
            { from: { element: { type: 'shared' } }, allow: { to: { element: { type: 'shared' } } } },
            // The client flows one way: entry → app → features → components/lib; features never import each other.
            { from: { element: { type: 'client-entry' } }, allow: { to: { element: { types: ['client-app', 'client-base', 'shared'] } } } },
            { from: { element: { type: 'client-app' } }, allow: { to: { element: { types: ['client-app', 'client-feature', 'client-base', 'shared'] } } } },
            {
              from: { element: { type: 'client-feature' } },
              allow: [
                { to: { element: { type: 'client-feature', captured: { name: '{{ from.element.captured.name }}' } } } },
                { to: { element: { types: ['client-base', 'shared'] } } },
              ],
            },
            { from: { element: { type: 'client-base' } }, allow: { to: { element: { types: ['client-base', 'shared'] } } } },
            // The server's base (db, http, config, the PDF and CSV writers) knows no component.
            { from: { element: { type: 'server-base' } }, allow: { to: { element: { types: ['server-base', 'shared'] } } } },
            // A component uses another only through its index or service file, never its entities or tables.
            {
              from: { element: { type: 'server-component' } },
              allow: [...sameOrPublic('server-component'), { to: { element: { types: ['server-base', 'shared'] } } }],
            },
            // The local stand-ins for the mail and payment providers know nothing of the product.
            { from: { element: { type: 'server-fakes' } }, allow: { to: { element: { types: ['server-fakes', 'server-base'] } } } },
            // app.ts, index.ts, the other top files and the demo seed compose everything.
            {
              from: { element: { type: 'server-root' } },
              allow: { to: { element: { types: ['server-root', 'server-component', 'server-fakes', 'server-base', 'shared'] } } },
            },
          ],
        },
      ],
    },
  },
];
