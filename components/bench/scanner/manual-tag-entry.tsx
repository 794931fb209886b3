"use client";

import { useState, type Ref } from "react";
import { checkTagCode, formatTagCode, isValidTagCode } from "@/lib/trade/tag-code";

/** An example that itself checks out (ISO/IEC 7064 MOD 37-2). */
const EXAMPLE = formatTagCode("HAWBR7H");
if (process.env.NODE_ENV !== "production" && !isValidTagCode(EXAMPLE)) throw new Error("the example tag code must be valid");

/**
 * Typing the tag code when the camera cannot read it. Same check as the scanner (lib/trade/tag-code): a wrong
 * code shows why, right beside the field, and keeps what was typed.
 */
export function ManualTagEntry({ onCode, inputRef }: { onCode: (code: string) => void; inputRef?: Ref<HTMLInputElement> }) {
  const [text, setText] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      noValidate
      aria-label="Type the tag code"
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const r = checkTagCode(text);
        if (!r.ok) {
          setError(r.message);
          return;
        }
        setError(null);
        onCode(r.value);
      }}
    >
      <label htmlFor="manual-tag-code" className="text-lg font-bold">
        Or type the tag code
      </label>
      <p id="manual-tag-code-hint" className="-mt-1 text-base text-ink-2">
        The 7 characters printed on the tag, e.g. <span className="whitespace-nowrap font-mono">{EXAMPLE}</span>. Dashes
        and spaces do not matter.
      </p>
      <div className="flex gap-3">
        <input
          ref={inputRef}
          id="manual-tag-code"
          name="tagCode"
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            if (error) setError(null);
          }}
          autoCapitalize="characters"
          autoComplete="off"
          autoCorrect="off"
          spellCheck={false}
          enterKeyHint="go"
          maxLength={16}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? "manual-tag-code-hint manual-tag-code-error" : "manual-tag-code-hint"}
          className={
            "tap-bench w-0 min-w-0 flex-1 rounded-2xl border-2 bg-surface px-4 font-mono text-2xl font-bold uppercase tracking-widest text-ink " +
            (error ? "border-bad" : "border-line focus:border-accent")
          }
        />
        <button type="submit" className="tap-bench rounded-2xl bg-accent px-5 text-lg font-bold text-accent-ink">
          Open
        </button>
      </div>
      {error ? (
        <p id="manual-tag-code-error" role="alert" className="font-semibold text-bad">
          {error}
        </p>
      ) : null}
    </form>
  );
}
