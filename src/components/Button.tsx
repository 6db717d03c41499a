import type { AnchorHTMLAttributes, ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';
/** `glove` is for the shop floor: at least 56 px tall, wide padding, large text. */
type Size = 'sm' | 'md' | 'glove';

type Look = { variant?: Variant; size?: Size };

const base =
  'inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors ' +
  'disabled:cursor-not-allowed disabled:opacity-50 select-none';

const variants: Record<Variant, string> = {
  primary: 'bg-copper-600 text-white hover:bg-copper-700 active:bg-copper-800',
  secondary: 'border border-graphite-300 bg-white text-graphite-900 hover:bg-paper-200',
  quiet: 'text-graphite-700 hover:bg-paper-200',
  danger: 'bg-fail text-white hover:bg-fail-ink',
};

const sizes: Record<Size, string> = {
  sm: 'h-8 px-3 text-sm',
  md: 'h-10 px-4 text-sm',
  glove: 'min-h-14 px-8 text-lg',
};

export function buttonClasses({ variant = 'primary', size = 'md' }: Look = {}, extra = ''): string {
  return `${base} ${variants[variant]} ${sizes[size]} ${extra}`.trim();
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & Look;

export function Button({ variant, size, className, type = 'button', ...rest }: ButtonProps) {
  return <button type={type} className={buttonClasses({ variant, size }, className)} {...rest} />;
}

type ButtonLinkProps = AnchorHTMLAttributes<HTMLAnchorElement> & Look & { href: string };

/** A plain anchor that looks like a button: for full-page navigations such as sign-in. */
export function ButtonLink({ variant, size, className, ...rest }: ButtonLinkProps) {
  return <a className={buttonClasses({ variant, size }, className)} {...rest} />;
}
