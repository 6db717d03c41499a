export interface StoredMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html?: string;
}

export type NewMessage = Omit<StoredMessage, 'id'>;

/** In-memory inbox, most recent first; ids count up from 1 for the life of the sink. */
export class MessageStore {
  private items: StoredMessage[] = [];
  private nextId = 1;

  add(message: NewMessage): StoredMessage {
    const stored = { ...message, id: this.nextId++ };
    this.items.unshift(stored);
    return stored;
  }

  list(): StoredMessage[] {
    return this.items.map((message) => ({ ...message, to: [...message.to] }));
  }

  get(id: number): StoredMessage | undefined {
    return this.items.find((message) => message.id === id);
  }

  clear(): void {
    this.items = [];
  }
}
