import type { ReactNode } from "react";

type Tone = "info" | "warning" | "success";

const TONES: Record<Tone, string> = {
  info: "border-lux/40 bg-lux-light/60",
  warning: "border-ember bg-ember-light",
  success: "border-lux bg-lux-light",
};

/** A boxed message; warnings are announced at once (role="alert"), the rest politely. */
export function Alert({ tone = "info", title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  return (
    <div role={tone === "warning" ? "alert" : "status"} className={`rounded-md border px-4 py-3 text-sm text-ink ${TONES[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className={title ? "mt-1" : ""}>{children}</div> : null}
    </div>
  );
}
