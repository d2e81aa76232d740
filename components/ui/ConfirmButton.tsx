"use client";

import type { ReactNode } from "react";

/** A submit button that asks first. */
export function ConfirmButton({ question, children, className }: { question: string; children: ReactNode; className?: string }) {
  return (
    <button className={className} onClick={(e) => { if (!window.confirm(question)) e.preventDefault(); }}>
      {children}
    </button>
  );
}
