import localFont from "next/font/local";

/** Inter (variable weight, Latin), shipped with the app from @fontsource-variable/inter: nothing is downloaded. */
export const inter = localFont({
  src: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2",
  weight: "100 900",
  display: "swap",
  variable: "--font-inter",
});
