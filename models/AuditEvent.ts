import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Who changed what in a trial, when, from what to what, and why. Append-only. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare trialId: string;
  declare userId: string;
  declare entityType: string;
  declare entityId: string;
  declare action: "create" | "update" | "delete";
  declare summary: string;
  declare oldValue: unknown;
  declare newValue: unknown;
  declare source: string;
  declare reason: string | null;
  /** True for changes made after the trial was locked, which the reviewer must see. */
  declare afterLock: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: false },
        entityType: { type: DataTypes.STRING(40), allowNull: false },
        entityId: { type: DataTypes.STRING(80), allowNull: false },
        action: { type: DataTypes.STRING(10), allowNull: false },
        summary: { type: DataTypes.STRING(500), allowNull: false },
        oldValue: { type: DataTypes.JSONB, allowNull: true },
        newValue: { type: DataTypes.JSONB, allowNull: true },
        source: { type: DataTypes.STRING(80), allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: true },
        afterLock: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "audit_events", modelName: "AuditEvent", updatedAt: false },
    );
  }
}
