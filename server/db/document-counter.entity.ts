import { Column, Entity } from 'typeorm';

/** The last number issued per organization and series; bumped in the issuing transaction (numbering.ts), so numbers have no gaps. */
@Entity({ name: 'document_counters' })
export class DocumentCounter {
  @Column({ name: 'organization_id', type: 'uuid', primary: true })
  organizationId: string;

  @Column({ type: 'text', primary: true })
  series: string;

  @Column({ name: 'last_number', type: 'integer' })
  lastNumber: number;
}
