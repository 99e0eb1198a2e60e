import next from "eslint-config-next";

const config = [
  ...next,
  { ignores: ["node_modules/**", ".next/**", ".next-*/**", "data/**", "db/migrations/**", "next-env.d.ts", "lib/toolpath/assembly/fast-line.ts"] },
];

export default config;
