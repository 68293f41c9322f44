import type { HTMLAttributes, ReactNode } from 'react';
import { cn } from '../../lib/cn';

type CardProps = HTMLAttributes<HTMLElement> & { as?: 'section' | 'div' | 'article' | 'aside'; tone?: 'plain' | 'emphasis' | 'caution' };

const tones = {
  plain: 'border-paper-edge bg-white/60',
  emphasis: 'border-currant/40 bg-currant-light/50',
  caution: 'border-amber/50 bg-amber-light/60',
};

export function Card({ as: Tag = 'section', tone = 'plain', className, ...rest }: CardProps) {
  return <Tag className={cn('rounded-card border p-5 sm:p-6', tones[tone], className)} {...rest} />;
}

export function CardTitle({ children, level = 2, className }: { children: ReactNode; level?: 2 | 3; className?: string }) {
  const Tag = level === 2 ? 'h2' : 'h3';
  return <Tag className={cn('mb-3 text-lg font-semibold text-ink', className)}>{children}</Tag>;
}
