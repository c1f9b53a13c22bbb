import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';

const styles: Record<Variant, string> = {
  primary: 'bg-iron text-plate hover:bg-iron-soft',
  secondary: 'bg-plate-deep text-iron border border-plate-line hover:bg-brass-light',
  danger: 'bg-due text-white hover:opacity-90',
  ghost: 'bg-transparent text-iron hover:bg-plate-deep',
};

export function Button({ variant = 'primary', className = '', type = 'button', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type={type}
      className={`inline-flex min-h-tap min-w-tap items-center justify-center gap-2 rounded-plate px-4 text-base font-semibold disabled:cursor-not-allowed disabled:opacity-50 ${styles[variant]} ${className}`}
      {...props}
    />
  );
}
