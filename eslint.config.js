// ESLint (flat config): the house rules of DEVELOPERS.md that a machine can check. Unused exports and files are
// checked by knip (knip.json), which `npm run lint` runs after ESLint.
import { readdirSync } from "node:fs";
import js from "@eslint/js";
import { createTypeScriptImportResolver } from "eslint-import-resolver-typescript";
import importX from "eslint-plugin-import-x";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

const features = readdirSync(new URL("./src/features", import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

/** Import boundaries, checked on resolved paths (relative imports and the `@/`, `@shared/` aliases alike). */
const zones = [
  // Client by feature: a feature uses shared pieces only; features are composed in src/app.
  ...features.map((feature) => ({
    target: `./src/features/${feature}`,
    from: "./src/features",
    except: [`./${feature}`],
    message: "Features don't import each other: move the shared piece to src/lib or src/components, or compose in src/app.",
  })),
  {
    target: ["./src/features", "./src/components", "./src/lib", "./src/config", "./src/types"],
    from: "./src/app",
    message: "Imports flow shared → features → app: only src/app composes.",
  },
  {
    target: ["./src/components", "./src/lib", "./src/config", "./src/types"],
    from: "./src/features",
    message: "Shared client code does not depend on a feature.",
  },
  {
    target: "./src",
    from: ["./server", "./scripts", "./tests"],
    message: "The client imports only from src/ and shared/.",
  },
  // shared/ is the contract of both sides and ships to the browser.
  {
    target: "./shared",
    from: ["./server", "./src", "./scripts", "./tests"],
    message: "shared/ imports nothing from server/ or src/: it ends up in the browser bundle.",
  },
  // Server in thin layers: routes → services → queries.
  {
    target: "./server/services",
    from: ["./server/middleware", "./server/routes"],
    message: "Services never see the HTTP layer: put what they share with it in server/services or server/errors.ts.",
  },
  {
    target: ["./server/routes", "./server/middleware"],
    from: ["./server/db/queries", "./server/db/schema", "./server/db/client.ts"],
    message: "Routes and middleware reach the database only through services (which call server/db/queries).",
  },
  {
    target: "./server/db",
    from: ["./server/routes", "./server/middleware"],
    message: "The data layer does not depend on the HTTP layer.",
  },
];

export default tseslint.config(
  {
    ignores: ["node_modules/", "dist/", ".data/", "test-artifacts/", "coverage/", "drizzle/", "public/"],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx,js}"],
    languageOptions: {
      ecmaVersion: 2023,
      sourceType: "module",
      globals: { ...globals.node, ...globals.browser },
    },
    plugins: { "import-x": importX },
    settings: {
      "import-x/resolver-next": [createTypeScriptImportResolver({ project: "./tsconfig.json" })],
    },
    rules: {
      "import-x/no-restricted-paths": ["error", { zones }],
      "@typescript-eslint/no-unused-vars": [
        "error",
        {
          args: "after-used",
          argsIgnorePattern: "^_",
          varsIgnorePattern: "^_",
          caughtErrors: "none",
          ignoreRestSiblings: true,
        },
      ],
    },
  },
  {
    // Tests build malformed documents on purpose and read untyped JSON answers; product code stays free of `any`.
    files: ["**/__tests__/**", "tests/**"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: {
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "error",
      // One home per query key (src/lib/query-keys.ts), so an invalidation in one feature matches another's query.
      "no-restricted-syntax": [
        "error",
        {
          selector: "Property[key.name='queryKey'][value.type='ArrayExpression']",
          message: "Query keys have one home: take this key from queryKeys in src/lib/query-keys.ts.",
        },
      ],
    },
  },
  {
    // Services reach the database through server/db/queries (which accept a transaction); types may be imported.
    files: ["server/services/**/*.ts"],
    ignores: ["server/**/__tests__/**"],
    rules: {
      "@typescript-eslint/no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["drizzle-orm", "drizzle-orm/*", "pg", "**/db/schema", "**/db/schema/*"],
              allowTypeImports: true,
              message: "Database access goes through server/db/queries (functions that take `(db, params)`).",
            },
          ],
        },
      ],
    },
  },
  {
    // No database access from the HTTP layer: no driver, no query builder (see the zones above for our own modules).
    files: ["server/routes/**/*.ts", "server/middleware/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          paths: [{ name: "pg", message: "Routes and middleware reach the database only through services." }],
          patterns: [{ group: ["drizzle-orm", "drizzle-orm/*"], message: "Routes and middleware reach the database only through services." }],
        },
      ],
    },
  },
);
