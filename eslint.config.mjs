import next from "eslint-config-next";

const config = [
  ...next,
  { ignores: [".next/**", "node_modules/**", "test-results/**", "public/**"] },
  {
    rules: {
      // Tests and fakes parse loosely typed JSON on purpose.
      "@typescript-eslint/no-explicit-any": "off",
      // One direction for every import: lib/payments never reaches back into lib/services.
      "import/no-cycle": ["error", { ignoreExternal: true }],
    },
  },
];

export default config;
