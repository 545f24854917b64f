import { createContext, useContext, useState, type ReactNode } from 'react';
import { useStore } from 'zustand';
import { createWorkbenchStore, type WorkbenchState, type WorkbenchStore } from './workbenchStore';

const StoreContext = createContext<WorkbenchStore | null>(null);

/** Provides one workbench store to the tree (a given one in tests, else a new one). */
export function StoreProvider({ store, children }: { store?: WorkbenchStore; children: ReactNode }) {
  const [value] = useState(() => store ?? createWorkbenchStore());
  return <StoreContext.Provider value={value}>{children}</StoreContext.Provider>;
}

export function useWorkbenchStore(): WorkbenchStore {
  const store = useContext(StoreContext);
  if (!store) throw new Error('useWorkbenchStore needs a <StoreProvider> above it');
  return store;
}

/** Select one value from the workbench state; the component re-renders only when it changes. */
export function useWorkbench<T>(selector: (s: WorkbenchState) => T): T {
  return useStore(useWorkbenchStore(), selector);
}
