import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** the fake outbox: every message the in-process SMTP server receives */
@Entity('mail_messages')
export class MailMessage {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @Column({ type: 'varchar', length: 254 }) to: string;
  @Column({ type: 'varchar', length: 254 }) from: string;
  @Column({ type: 'varchar', length: 300 }) subject: string;
  @Column({ type: 'text' }) text: string;
  @Column({ type: 'text' }) html: string;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
