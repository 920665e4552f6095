// ESLint flat config. It lives in scripts/ to keep the top level small; basePath points it at the repo.
import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

export default defineConfig([
  { basePath: ".." },
  ...nextVitals,
  ...nextTs,
  globalIgnores(["node_modules/**", ".next/**", ".data/**", "next-env.d.ts", "drizzle/**"]),
  {
    // The engine is framework-free: nothing of the app, React, Next, the database or zod.
    files: ["src/engine/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [
        { group: ["react", "react-*", "next", "next/*", "zod", "drizzle-orm", "drizzle-orm/*", "pg", "@/server/*", "@/app/*", "@/editor/*", "@/components/*", "@/lib/*", "@/contracts/*"], message: "src/engine imports only itself." },
      ] }],
    },
  },
  {
    files: ["src/contracts/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [
        { group: ["react", "next", "next/*", "@/server/*", "@/app/*", "@/editor/*", "@/components/*", "server-only"], message: "src/contracts may import only the engine and zod." },
      ] }],
    },
  },
  {
    // What a figure reads like and what the views draw: pure TypeScript the editor and the server share.
    files: ["src/figures/**/*.ts", "src/drawing/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [
        { group: ["react", "react-*", "next", "next/*", "konva", "drizzle-orm", "drizzle-orm/*", "pg", "server-only", "@/server/*", "@/app/*", "@/editor/*", "@/components/*", "@/lib/*"], message: "src/figures and src/drawing import only the engine, the contracts and each other (drawing may import figures, not the other way)." },
      ] }],
    },
  },
  {
    files: ["src/figures/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [
        { group: ["react", "react-*", "next", "next/*", "konva", "drizzle-orm", "drizzle-orm/*", "pg", "server-only", "@/server/*", "@/app/*", "@/editor/*", "@/components/*", "@/lib/*", "@/drawing/*"], message: "src/figures imports only the engine, the contracts and itself." },
      ] }],
    },
  },
  {
    // The server renders exports from the shared drawing and figures, never from the editor's client code.
    files: ["src/server/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [
        { group: ["react", "react-*", "konva", "@/app/*", "@/editor/*", "@/components/*", "@/lib/*"], message: "src/server imports the engine, the contracts, src/drawing and src/figures; never the editor, components, lib or app." },
      ] }],
    },
  },
  {
    files: ["src/editor/**/*.{ts,tsx}", "src/components/**/*.{ts,tsx}", "src/lib/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [
        { group: ["@/server/*", "@/app/*", "server-only", "../../server/*", "../../app/*", "../../../server/*", "../../../app/*"], message: "Client code (editor, components, lib) never imports the server or app: the editor may import engine, contracts, lib and components." },
      ] }],
    },
  },
]);
