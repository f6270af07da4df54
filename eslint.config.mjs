import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

/**
 * The folder dependency rule (DEVELOPERS.md): app → components, lib; components → lib/domain,
 * lib/validation (never models or lib/server); lib/server → models, lib/domain; lib/domain → nothing of ours.
 */
const SERVER_ONLY = [
  { group: ["@/models", "@/models/*", "**/models/*"], message: "Only lib/server talks to the models." },
  { group: ["@/lib/server", "@/lib/server/*"], message: "Components get data from pages, actions or the API, not lib/server." },
];

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", ".data/**", "node_modules/**", ".test-artifacts/**", "next-env.d.ts", "public/**"],
  },
  {
    files: ["lib/domain/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              regex: "^(@/(?!lib/domain(/|$))|next(/|$)|react(-dom)?$|sequelize$|mariadb$|mysql2|node:|fs$|path$)",
              message: "lib/domain is pure: it imports nothing of ours but itself, and no framework, database or I/O.",
            },
          ],
        },
      ],
      "no-restricted-globals": ["error", { name: "process", message: "Pass settings in as arguments." }],
      "no-restricted-syntax": [
        "error",
        { selector: "CallExpression[callee.object.name='Date'][callee.property.name='now']", message: "Pass `now` in as an argument." },
        { selector: "NewExpression[callee.name='Date'][arguments.length=0]", message: "Pass `now` in as an argument." },
      ],
    },
  },
  {
    files: ["components/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": ["error", { patterns: SERVER_ONLY }],
    },
  },
  {
    files: ["lib/validation/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [...SERVER_ONLY, { group: ["next", "next/*", "react"], message: "Schemas are shared by client and server; keep them framework-free." }] },
      ],
    },
  },
  {
    files: ["app/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [SERVER_ONLY[0]] }],
    },
  },
  {
    files: ["tests/**/*.ts", "scripts/**/*.{ts,mjs}", "seed/**/*.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
];

export default config;
