import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "quiet";

const variants: Record<Variant, string> = {
  primary: "bg-copper text-paper hover:bg-copper/90 disabled:bg-copper/50",
  secondary: "border border-rule bg-white/60 text-ink hover:border-ink/40 disabled:text-ink/40",
  danger: "bg-signal text-paper hover:bg-signal/90 disabled:bg-signal/50",
  quiet: "text-ink/80 hover:text-copper disabled:text-ink/30",
};

export function Button({
  variant = "secondary",
  className = "",
  type = "button",
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-1.5 rounded px-3 py-1.5 text-sm font-medium disabled:cursor-not-allowed ${variants[variant]} ${className}`}
      {...rest}
    />
  );
}
