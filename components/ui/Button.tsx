import type { ButtonHTMLAttributes } from "react";

const variants = {
  primary: "bg-leaf-600 text-white hover:bg-leaf-700 disabled:bg-soil-200 disabled:text-soil-500",
  secondary: "border border-soil-200 bg-white text-soil-900 hover:bg-soil-100",
} as const;

export function Button({
  variant = "primary",
  className = "",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: keyof typeof variants }) {
  return <button className={`rounded px-4 py-2 text-sm font-medium ${variants[variant]} ${className}`} {...props} />;
}
