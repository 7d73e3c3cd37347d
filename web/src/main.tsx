import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { QueryClientProvider } from "@tanstack/react-query";
import "@fontsource/public-sans/400.css";
import "@fontsource/public-sans/600.css";
import "@fontsource/public-sans/700.css";
import "./styles.css";
import { connectSessionBridge } from "./api/client";
import { queryClient } from "./api/queryClient";
import App, { router } from "./App";
import { ErrorBoundary } from "./components/ErrorBoundary";
import { createSessionBridge } from "./lib/sessionBridge";

connectSessionBridge(createSessionBridge(queryClient, router));

const rootElement = document.getElementById("root");
if (!rootElement) throw new Error("The page has no #root element to render into.");

createRoot(rootElement).render(
  <StrictMode>
    <ErrorBoundary>
      <QueryClientProvider client={queryClient}>
        <App />
      </QueryClientProvider>
    </ErrorBoundary>
  </StrictMode>,
);
