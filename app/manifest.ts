import type { MetadataRoute } from "next";

/** The web app manifest (served at /manifest.webmanifest): installs the bench to the home screen. */
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: "/bench",
    name: "Benchwright",
    short_name: "Benchwright",
    description: "The shop's bench on your phone: today's work, tag scanning, bench sheets and shop tools, with or without a network.",
    start_url: "/bench",
    scope: "/",
    display: "standalone",
    orientation: "portrait",
    // app/globals.css: --color-bg (light) for the splash and title bar.
    background_color: "#f6f6f9",
    theme_color: "#f6f6f9",
    categories: ["business", "productivity", "utilities"],
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/maskable-192.png", sizes: "192x192", type: "image/png", purpose: "maskable" },
      { src: "/icons/maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
    shortcuts: [
      {
        name: "Scan a tag",
        short_name: "Scan",
        description: "Open the camera and scan a machine's tag",
        url: "/bench/scan",
        icons: [{ src: "/icons/icon-192.png", sizes: "192x192", type: "image/png" }],
      },
      {
        name: "Today's work",
        short_name: "Today",
        description: "The tickets on your bench today",
        url: "/bench",
        icons: [{ src: "/icons/icon-192.png", sizes: "192x192", type: "image/png" }],
      },
    ],
  };
}
