// The web build's stand-in for zod's locale barrel: Phasewise speaks English only, so the other
// 63 locales (≈ 270 KiB) stay out of the bundle. See metro.config.js.
export { default as en } from "zod/v4/locales/en.js";
