import { Description, Dialog, DialogPanel, DialogTitle } from '@headlessui/react';
import type { ReactNode } from 'react';

type ModalProps = {
  open: boolean;
  onClose: () => void;
  title: string;
  /** One or two sentences under the title, announced with it. */
  description?: ReactNode;
  children: ReactNode;
};

/**
 * A modal dialog (Headless UI): titled, traps focus, closes on Escape, and returns focus to
 * the control that opened it.
 */
export const Modal = ({ open, onClose, title, description, children }: ModalProps) => (
  <Dialog open={open} onClose={onClose} className="relative z-50">
    <div className="fixed inset-0 bg-ink-deep/60" aria-hidden="true" />
    <div className="fixed inset-0 overflow-y-auto">
      <div className="flex min-h-full items-start justify-center p-3 sm:items-center sm:p-6">
        <DialogPanel className="w-full max-w-xl rounded-xl border-2 border-ink bg-surface p-5 shadow-xl sm:p-8">
          <DialogTitle as="h2" className="text-2xl font-bold text-ink">
            {title}
          </DialogTitle>
          {description && <Description className="mt-2 text-ink-soft">{description}</Description>}
          <div className="mt-5">{children}</div>
        </DialogPanel>
      </div>
    </div>
  </Dialog>
);
