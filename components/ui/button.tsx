import type { ButtonHTMLAttributes } from "react";
import Link from "next/link";
import { cx } from "./cx";

export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger";

const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-accent text-white hover:bg-accent-strong border border-accent-strong/40 shadow-sm",
  secondary: "bg-surface text-ink hover:bg-sunken border border-line-strong",
  quiet: "bg-transparent text-accent hover:bg-accent-soft border border-transparent",
  danger: "bg-surface text-danger hover:bg-danger-soft border border-danger/40",
};

const SIZES = { sm: "h-8 px-2.5 text-sm", md: "h-9 px-3.5 text-sm" } as const;

export function buttonClass(variant: ButtonVariant = "secondary", size: keyof typeof SIZES = "md"): string {
  return cx(
    "inline-flex items-center justify-center gap-1.5 rounded-md font-medium whitespace-nowrap transition-colors",
    "disabled:opacity-50 disabled:pointer-events-none",
    VARIANTS[variant],
    SIZES[size],
  );
}

export function Button({
  variant = "secondary",
  size = "md",
  className,
  type = "button",
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant; size?: keyof typeof SIZES }) {
  return <button type={type} className={cx(buttonClass(variant, size), className)} {...rest} />;
}

export function ButtonLink({
  href,
  variant = "secondary",
  size = "md",
  children,
  className,
}: {
  href: string;
  variant?: ButtonVariant;
  size?: keyof typeof SIZES;
  children: React.ReactNode;
  className?: string;
}) {
  return (
    <Link href={href} className={cx(buttonClass(variant, size), className)}>
      {children}
    </Link>
  );
}
