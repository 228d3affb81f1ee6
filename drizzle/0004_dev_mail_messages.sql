CREATE TABLE "dev_mail_messages" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"from_address" text NOT NULL,
	"to_addresses" text[] NOT NULL,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"html" text,
	"size_bytes" integer NOT NULL,
	"message_id" text,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "dev_mail_messages_received_at_idx" ON "dev_mail_messages" USING btree ("received_at");