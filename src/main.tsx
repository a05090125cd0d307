import { StrictMode } from "react";
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

createRoot(document.getElementById("root")!).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
