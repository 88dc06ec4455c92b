import type { ComponentPropsWithRef } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { type ButtonVariant, buttonClasses } from './button-classes';

type ButtonProps = ComponentPropsWithRef<'button'> & { variant?: ButtonVariant };

export const Button = ({ variant = 'secondary', className, type = 'button', ...props }: ButtonProps) => (
  <button type={type} className={buttonClasses(variant, className)} {...props} />
);

type ButtonLinkProps = LinkProps & { variant?: ButtonVariant };

export const ButtonLink = ({ variant = 'secondary', className, ...props }: ButtonLinkProps) => (
  <Link className={buttonClasses(variant, className)} {...props} />
);
