import { z } from 'zod';
import './messages';

/** The name of a production item (swatch, board, curve, look): trimmed, 1–120 characters. */
export const itemNameSchema = z.string().trim().min(1, 'Give a name.').max(120, 'A name takes at most 120 characters.');

/** What every production item's view carries: its id, name and notes, who made it and when (ISO 8601). */
export interface ItemView {
  id: number;
  name: string;
  notes: string;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
}

