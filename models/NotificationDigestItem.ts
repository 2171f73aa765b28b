import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A notification held for someone's daily digest instead of its own mail. */
export class NotificationDigestItem extends Model<InferAttributes<NotificationDigestItem>, InferCreationAttributes<NotificationDigestItem>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare type: string;
  declare summary: string;
  declare link: string;
  declare digestedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    NotificationDigestItem.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        type: { type: DataTypes.STRING(40), allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        link: { type: DataTypes.TEXT, allowNull: false },
        digestedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "notification_digest_items", modelName: "NotificationDigestItem" },
    );
  }
}
