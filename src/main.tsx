import "@fontsource/ibm-plex-sans/400.css";
import "@fontsource/ibm-plex-sans/500.css";
import "@fontsource/ibm-plex-sans/600.css";
import "@fontsource/ibm-plex-mono/400.css";
import "./index.css";
import { StrictMode } from "react";
import { config as zodConfig } from "zod/v4/core";
import { createRoot } from "react-dom/client";
import { App } from "./app/app";

// The engine's schema checks use zod; without this, zod probes eval once and the CSP refuses it.
zodConfig({ jitless: true });

createRoot(document.getElementById("root")!).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
