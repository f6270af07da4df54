import { cn } from "@/lib/cn";

export type ButtonVariant = "primary" | "secondary" | "danger" | "quiet";

export interface ButtonProps extends React.ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: "md" | "lg";
}

const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-steel text-white hover:bg-steel-dark border-steel-dark",
  secondary: "bg-paper-raised text-ink hover:bg-paper-sunk border-line-strong",
  danger: "bg-bad text-white hover:brightness-95 border-bad",
  quiet: "bg-transparent text-steel hover:bg-steel-light border-transparent",
};

export function buttonClasses(variant: ButtonVariant = "primary", size: "md" | "lg" = "md", className?: string) {
  return cn(
    "inline-flex items-center justify-center gap-2 rounded-md border font-bold transition-colors disabled:cursor-not-allowed disabled:opacity-60",
    size === "lg" ? "min-h-touch px-5 text-lg" : "min-h-10 px-4 text-sm",
    VARIANTS[variant],
    className,
  );
}

export function Button({ variant = "primary", size = "md", className, type = "button", ...props }: ButtonProps) {
  return <button type={type} className={buttonClasses(variant, size, className)} {...props} />;
}
