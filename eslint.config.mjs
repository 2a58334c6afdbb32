// ESLint 9 flat config: Next's rules (React, react-hooks with the React Compiler checks, Next, a11y),
// typescript-eslint's recommended set, and the dependency rule of DEVELOPERS.md as import boundaries.
// Style is Prettier's job: no stylistic rule is turned on here.
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

// Which other features a feature may import, besides the shared ones every feature may use.
// Keep it acyclic and short; DEVELOPERS.md ("Dependency rule") explains each edge.
const SHARED_FEATURES = ["ui", "forms", "analysis"];
const FEATURE_EDGES = {
  accounts: [],
  activity: [],
  analysis: [],
  attachments: [],
  designs: ["activity"],
  editor: ["designs", "library", "fe-check"],
  exports: ["activity", "reviews", "fe-check"],
  "fe-check": [],
  forms: [],
  health: [],
  imports: ["designs"],
  library: [],
  marketing: [],
  reviews: ["activity", "fe-check"],
  shell: ["accounts"],
  ui: [],
};

const featureZones = Object.entries(FEATURE_EDGES).map(([feature, edges]) => ({
  target: `./features/${feature}`,
  from: "./features",
  except: [...new Set([feature, ...SHARED_FEATURES, ...edges])].map((f) => `./${f}`),
  message: `features/${feature} may import only ${[...SHARED_FEATURES, ...edges].join(", ")} among the features (DEVELOPERS.md, "Dependency rule").`,
}));

const boundaryZones = [
  {
    target: "./features/analysis/core",
    from: ".",
    except: ["./features/analysis/core"],
    message: "The engineering core imports nothing outside features/analysis/core.",
  },
  ...featureZones,
  {
    target: "./server",
    from: "./features",
    except: ["./analysis/core"],
    message: "server/ imports db/ and the core only; code that needs feature queries belongs in the feature.",
  },
  {
    target: "./db",
    from: "./server",
    except: ["./env.ts"],
    message: "db/ imports only server/env.ts.",
  },
  {
    target: "./db",
    from: "./features",
    except: ["./analysis/core"],
    message: "db/ imports no feature (only the core's types, for its JSON columns).",
  },
  {
    target: ["./features", "./server", "./db"],
    from: "./app",
    message: "Nothing imports app/ (routes only).",
  },
];

// A "use client" module never imports server/ or the database instance (type-only imports are
// erased and allowed). Files cannot be selected by their directive, so this is a small local rule.
const clientBoundary = {
  meta: {
    type: "problem",
    docs: { description: "client components never import server/ or db/index" },
    schema: [],
  },
  create(context) {
    const program = context.sourceCode.ast;
    const isClient = program.body.some(
      (node) => node.type === "ExpressionStatement" && node.directive === "use client",
    );
    if (!isClient) return {};
    const forbidden = (source) => /^@\/(server\/|db\/index)/.test(source) || /(^|\/)server\//.test(source);
    const check = (node) => {
      if (node.importKind === "type" || node.exportKind === "type") return;
      if (node.source && forbidden(node.source.value))
        context.report({
          node: node.source,
          message: `A client component imports ${node.source.value}: pass server data in as props or use a route.`,
        });
    };
    return { ImportDeclaration: check, ExportNamedDeclaration: check, ExportAllDeclaration: check };
  },
};

// An effect without a dependency list runs after every render; say which values it follows (or
// [] for once). react-hooks' exhaustive-deps checks a list that is there, not a missing one.
const effectDeps = {
  meta: {
    type: "problem",
    docs: { description: "useEffect / useLayoutEffect always take a dependency list" },
    schema: [],
  },
  create(context) {
    const EFFECTS = new Set(["useEffect", "useLayoutEffect", "useInsertionEffect"]);
    return {
      CallExpression(node) {
        const callee = node.callee;
        const name =
          callee.type === "Identifier"
            ? callee.name
            : callee.type === "MemberExpression" && callee.property.type === "Identifier"
              ? callee.property.name
              : null;
        if (name && EFFECTS.has(name) && node.arguments.length === 1)
          context.report({
            node,
            message: `${name} without a dependency list runs after every render: pass the values it reads, or [].`,
          });
      },
    };
  },
};

export default [
  ...nextVitals,
  ...nextTypescript,
  {
    ignores: [
      ".next/**",
      ".next-test-*/**",
      ".data/**",
      ".build/**",
      "out/**",
      "test-results/**",
      "playwright-report/**",
      "blob-report/**",
      "bench/results/**",
      "tmp/**",
    ],
  },
  {
    files: ["**/*.{ts,tsx,mjs}"],
    plugins: { sealpitch: { rules: { "client-boundary": clientBoundary, "effect-deps": effectDeps } } },
    rules: {
      "sealpitch/client-boundary": "error",
      "sealpitch/effect-deps": "error",
      // Next's preset leaves this a warning, which `npm test` (lint --quiet) would not show.
      "react-hooks/exhaustive-deps": "error",
      "import/no-restricted-paths": ["error", { zones: boundaryZones }],
      "@typescript-eslint/no-unused-vars": [
        "warn",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrorsIgnorePattern: "^_" },
      ],
      "import/no-anonymous-default-export": "off",
    },
  },
  {
    // Kysely's documented migration signature is `Kysely<any>`: a migration must not depend on
    // today's Database type. Landed migrations are never edited.
    files: ["migrations/**", "db/migrate.ts", "db/migrate-to-latest.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
];
