import './messages';
import { nameText } from './names';

/** The name of a production item (swatch, board, curve, look, photo): trimmed, 1–120 characters, nothing invisible (names.ts). */
export const itemNameSchema = nameText(120);

/** What every production item's view carries: its id, name and notes, who made it and when (ISO 8601). */
export interface ItemView {
  id: number;
  name: string;
  notes: string;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
}

