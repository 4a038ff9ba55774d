import localFont from "next/font/local";

/** Inter (variable weight), shipped with the app from the npm package: no network at build time. */
export const inter = localFont({
  src: [
    { path: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2", style: "normal", weight: "100 900" },
    { path: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-italic.woff2", style: "italic", weight: "100 900" },
  ],
  variable: "--font-inter",
  display: "swap",
});
