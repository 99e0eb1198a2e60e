"use client";

import { useState } from "react";

/** On a tablet or phone the menu folds away behind a button; on a wide screen it always shows. */
export function CollapsibleNav({ children }: { children: React.ReactNode }) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <button
        type="button"
        aria-expanded={open}
        aria-controls="main-menu"
        onClick={() => setOpen((v) => !v)}
        className="mx-4 mb-2 rounded-md border border-paper/30 px-3 py-1.5 text-sm text-paper lg:hidden"
      >
        {open ? "Close the menu" : "Menu"}
      </button>
      {/* Following a link closes the menu again. */}
      <div id="main-menu" className={`${open ? "block" : "hidden"} px-2 pb-4 lg:block`} onClick={(e) => (e.target as HTMLElement).closest("a") && setOpen(false)}>
        {children}
      </div>
    </>
  );
}
