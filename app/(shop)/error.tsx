"use client";

// The shop pages show the same recoverable error screen as the rest of the app.
export { default } from "../error";
