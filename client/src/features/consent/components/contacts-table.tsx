import type { Contact } from '@keyloom/shared';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';

type ContactsTableProps = {
  contacts: readonly Contact[];
  canEdit: boolean;
  onEdit: (contact: Contact) => void;
  onDelete: (contact: Contact) => void;
  onRenew: (contact: Contact) => void;
};

const summariesBadge = (contact: Contact) => {
  if (contact.unsubscribedAt) return <Badge tone="warn">Stopped them</Badge>;
  return contact.consentToSummaries ? <Badge tone="good">Yes</Badge> : <Badge tone="neutral">No</Badge>;
};

/** The client's family contacts and whether each receives summaries. */
export const ContactsTable = ({ contacts, canEdit, onEdit, onDelete, onRenew }: ContactsTableProps) => (
  <Table caption={`Family contacts (${contacts.length})`}>
    <TableHead>
      <ColumnHeader>Name</ColumnHeader>
      <ColumnHeader>Relationship</ColumnHeader>
      <ColumnHeader>E-mail</ColumnHeader>
      <ColumnHeader>Receives summaries</ColumnHeader>
      {canEdit && <ColumnHeader>Change</ColumnHeader>}
    </TableHead>
    <TableBody>
      {[...contacts]
        .sort((a, b) => a.name.localeCompare(b.name, 'en'))
        .map((contact) => (
          <TableRow key={contact.id}>
            <RowHeader label="Name">{contact.name}</RowHeader>
            <TableCell label="Relationship">{contact.relationship}</TableCell>
            <TableCell label="E-mail" className="break-all">
              {contact.email}
            </TableCell>
            <TableCell label="Receives summaries">{summariesBadge(contact)}</TableCell>
            {canEdit && (
              <TableCell label="Change">
                <div className="flex flex-wrap gap-2">
                  <Button onClick={() => onEdit(contact)} aria-label={`Edit ${contact.name}`}>
                    Edit
                  </Button>
                  <Button
                    variant="danger"
                    onClick={() => onDelete(contact)}
                    aria-label={`Delete ${contact.name}`}
                  >
                    Delete
                  </Button>
                  {contact.unsubscribedAt && (
                    <Button
                      onClick={() => onRenew(contact)}
                      aria-label={`Record the family’s new consent to summaries for ${contact.name}`}
                    >
                      Record the family’s new consent to summaries
                    </Button>
                  )}
                </div>
              </TableCell>
            )}
          </TableRow>
        ))}
    </TableBody>
  </Table>
);
