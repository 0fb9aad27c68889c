import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('productions')
export class Production {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'text', default: '' }) description: string;
  /** marks invented demo content */
  @Column({ type: 'boolean', default: false }) isDemo: boolean;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
