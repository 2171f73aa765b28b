import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const notificationDeliveries = ["immediate", "digest"] as const;
export type NotificationDelivery = (typeof notificationDeliveries)[number];

/** A person's choices about notification mail; no row means every kind, one mail per event. */
export class NotificationSetting extends Model<InferAttributes<NotificationSetting>, InferCreationAttributes<NotificationSetting>> {
  declare userId: string;
  declare delivery: CreationOptional<NotificationDelivery>;
  declare mutedTypes: CreationOptional<string[]>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    NotificationSetting.init(
      {
        userId: { type: DataTypes.UUID, primaryKey: true },
        delivery: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "immediate" },
        mutedTypes: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "notification_settings", modelName: "NotificationSetting" },
    );
  }
}
