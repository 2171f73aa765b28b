import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    // Outgoing mail: written in the triggering request, sent later by the worker.
    await queryInterface.createTable(
      "mail_messages",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        to_address: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        text_body: { type: DataTypes.TEXT, allowNull: false },
        html_body: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "pending" },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        next_attempt_at: { type: DataTypes.DATE, allowNull: false },
        locked_until: { type: DataTypes.DATE, allowNull: true },
        last_error: { type: DataTypes.TEXT, allowNull: true },
        sent_at: { type: DataTypes.DATE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint("mail_messages", {
      type: "check", fields: ["status"], name: "mail_messages_status_known",
      where: { status: ["pending", "sending", "sent", "failed"] }, transaction,
    });
    await queryInterface.addIndex("mail_messages", ["status", "next_attempt_at"], { transaction });
    await queryInterface.addIndex("mail_messages", ["created_at"], { transaction });

    await queryInterface.createTable(
      "invitations",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: { type: DataTypes.UUID, allowNull: false, references: { model: "trials", key: "id" }, onDelete: "CASCADE" },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false },
        token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        invited_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        sent_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        accepted_at: { type: DataTypes.DATE, allowNull: true },
        accepted_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
        revoked_at: { type: DataTypes.DATE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint("invitations", {
      type: "check", fields: ["role"], name: "invitations_role_known", where: { role: ["technician", "reviewer"] }, transaction,
    });
    await queryInterface.addIndex("invitations", ["trial_id"], { transaction });

    await queryInterface.createTable(
      "password_reset_tokens",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        used_at: { type: DataTypes.DATE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addIndex("password_reset_tokens", ["user_id"], { transaction });

    // Attempts counted in the database, so every app server applies the same limit.
    await queryInterface.createTable(
      "rate_limit_hits",
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        bucket: { type: DataTypes.STRING(200), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex("rate_limit_hits", ["bucket", "created_at"], { transaction });

    await queryInterface.createTable(
      "notification_settings",
      {
        user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        delivery: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "immediate" },
        muted_types: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint("notification_settings", {
      type: "check", fields: ["delivery"], name: "notification_settings_delivery_known", where: { delivery: ["immediate", "digest"] }, transaction,
    });

    await queryInterface.createTable(
      "notification_digest_items",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        type: { type: DataTypes.STRING(40), allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        link: { type: DataTypes.TEXT, allowNull: false },
        digested_at: { type: DataTypes.DATE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addIndex("notification_digest_items", ["user_id", "digested_at"], { transaction });

    // One row per scheduled job and day: the first server to insert it runs the job.
    await queryInterface.createTable(
      "job_runs",
      {
        name: { type: DataTypes.STRING(60), primaryKey: true },
        run_key: { type: DataTypes.STRING(40), primaryKey: true },
        started_at: { type: DataTypes.DATE, allowNull: false },
        finished_at: { type: DataTypes.DATE, allowNull: true },
      },
      { transaction },
    );
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    for (const table of ["job_runs", "notification_digest_items", "notification_settings", "rate_limit_hits", "password_reset_tokens", "invitations", "mail_messages"]) {
      await queryInterface.dropTable(table, { transaction });
    }
  });
}
