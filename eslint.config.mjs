import next from "eslint-config-next";

const config = [
  ...next,
  { ignores: ["node_modules/**", ".next/**", ".next-*/**", "data/**", "db/migrations/**", "next-env.d.ts", "lib/toolpath/assembly/fast-line.ts", "lib/toolpath/assembly/plain-moves.ts", "lib/toolpath/assembly/layout.ts", "lib/toolpath/assembly/index.ts"] },
];

export default config;
