import { StrictMode, startTransition } from "react";
import { createRoot } from "react-dom/client";
import { QueryClientProvider } from "@tanstack/react-query";
import { RouterProvider } from "react-router-dom";
import { router } from "./app/router";
import { makeQueryClient } from "./lib/query-client";
import { meQueryOptions } from "./lib/session";
import "./styles/app.css";

const queryClient = makeQueryClient();
// Every page first asks who is signed in: ask now, while the page's own code is still on its way.
void queryClient.prefetchQuery(meQueryOptions());

const root = createRoot(document.getElementById("root")!);
// The first render in pieces React can pause between, so the page answers a tap while it is drawn.
startTransition(() =>
  root.render(
    <StrictMode>
      <QueryClientProvider client={queryClient}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </StrictMode>,
  ),
);
