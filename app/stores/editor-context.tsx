// One editor store per open editor, handed down by context; components read
// it through selectors so a change re-renders only the parts that use it.
import { createContext, useContext, useState, type ReactNode } from "react";
import { useStore } from "zustand";
import { createEditorStore, type EditorInit, type EditorState, type EditorStore } from "./editor-store";

const EditorStoreContext = createContext<EditorStore | null>(null);

/** Makes the store once for the editor's lifetime (the server render makes its own). */
export function EditorStoreProvider({ init, store: given, children }: { init?: EditorInit; store?: EditorStore; children: ReactNode }) {
  const [store] = useState(() => given ?? createEditorStore(init!));
  return <EditorStoreContext.Provider value={store}>{children}</EditorStoreContext.Provider>;
}

export function useEditorStore(): EditorStore {
  const store = useContext(EditorStoreContext);
  if (!store) throw new Error("useEditor must be used inside an EditorStoreProvider");
  return store;
}

export function useEditor<T>(selector: (state: EditorState) => T): T {
  return useStore(useEditorStore(), selector);
}
