import { Column, Index, JoinColumn, ManyToOne } from 'typeorm';
import { Organization } from '../organizations/organization.entity';

/** Every business row belongs to one organization. Entities extend this so
 * the scoped manager (db/scoped.ts) can add the organization to every query. */
export abstract class OrgOwned {
  @Index()
  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => Organization, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'organization_id' })
  organization?: Organization;
}
