import { cx } from "./cx";

type Variant = "primary" | "secondary" | "quiet" | "danger";

const styles: Record<Variant, string> = {
  primary: "bg-copper text-white hover:bg-copper-deep border-copper-deep",
  secondary: "bg-card text-ink hover:bg-paper-deep border-rule",
  quiet: "bg-transparent text-ink-soft hover:bg-paper-deep border-transparent",
  danger: "bg-card text-bad hover:bg-bad-wash border-bad/40",
};

export function buttonClass(variant: Variant = "secondary", extra?: string) {
  return cx(
    "inline-flex min-h-10 items-center justify-center gap-2 rounded-md border px-4 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-50",
    styles[variant],
    extra,
  );
}

export function Button({ variant = "secondary", className, ...rest }: React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type="button" className={buttonClass(variant, className)} {...rest} />;
}
