import { Column, Index, JoinColumn, ManyToOne } from 'typeorm';

/** Every business row belongs to one organization. Entities extend this so
 * the scoped manager (db/scoped.ts) can add the organization to every query. */
export abstract class OrgOwned {
  @Index()
  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  // By name, so db/ knows no component: the organizations component registers the entity.
  @ManyToOne('Organization', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'organization_id' })
  organization?: unknown;
}
