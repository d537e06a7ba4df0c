// The nonce of the page being rendered on the server (app/entry.server.tsx
// makes one per answer), for the scripts and styles the root renders. In the
// browser it is empty, as the browser shows the server's once the page has
// read it, so that hydration finds the two the same.
import { createContext, useContext } from "react";

export const NonceContext = createContext("");

export const useNonce = () => useContext(NonceContext);
