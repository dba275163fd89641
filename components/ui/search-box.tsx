"use client";

import { useEffect, useState } from "react";
import { Field } from "@/components/ui/text-field";

const DEBOUNCE_MS = 300;

/** Typing updates ?q= once the user pauses, so each keystroke does not become a request. */
export function SearchBox({
  id,
  placeholder,
  value,
  onSearch,
}: {
  id: string;
  placeholder: string;
  value: string;
  onSearch: (q: string) => void;
}) {
  const [text, setText] = useState(value);
  const [seen, setSeen] = useState(value);
  const [sent, setSent] = useState<string | null>(null);

  // When ?q= changes from elsewhere ("Clear filters", back button), show it; an echo of our own
  // debounced update must not overwrite what the user typed since.
  if (value !== seen) {
    setSeen(value);
    if (value !== sent) setText(value);
  }

  useEffect(() => {
    const q = text.trim();
    if (q === value) return;
    const timer = setTimeout(() => {
      setSent(q);
      onSearch(q);
    }, DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [text, value, onSearch]);

  return (
    <Field id={id} label="Search" className="w-full sm:w-72">
      {(control) => (
        <input {...control} type="search" placeholder={placeholder} value={text} onChange={(event) => setText(event.target.value)} />
      )}
    </Field>
  );
}
