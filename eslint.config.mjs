import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", "node_modules/**", "data/**", "drizzle/**", "next-env.d.ts", "test-results/**", "playwright-report/**"],
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    // Test helpers named use… are not React hooks.
    files: ["tests/**"],
    rules: { "react-hooks/rules-of-hooks": "off" },
  },
];

export default config;
