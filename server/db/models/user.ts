import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '@/shared/api';
import { userRowsChanged } from '@/server/auth/userRowCache';

type HookOptions = { transaction?: { afterCommit(fn: () => void): void } | null };
/** Every write to users through the model: this process's cached rows are forgotten once it commits (auth/userRowCache.ts). */
const forgetOne = (user: User, options: HookOptions) => userRowsChanged(user.id ?? null, options.transaction);
const forgetAll = (options: HookOptions) => userRowsChanged(null, options.transaction);

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string;
  declare disabled: CreationOptional<boolean>;
  /** bumped by sign-out and password changes; a token issued under an older version is refused */
  declare tokenVersion: CreationOptional<number>;
  /** set when an admin gives a temporary password; cleared by the person's own change */
  declare mustChangePassword: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** What the API shows of a person: never the hash. */
  toPublic() {
    return {
      id: this.id,
      email: this.email,
      name: this.name,
      role: this.role,
      disabled: this.disabled,
      mustChangePassword: this.mustChangePassword,
      createdAt: this.createdAt,
    };
  }
}

export function defineUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      email: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      role: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT, allowNull: false, field: 'password_hash' },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: 'token_version' },
      mustChangePassword: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false, field: 'must_change_password' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    {
      sequelize,
      tableName: 'users',
      modelName: 'User',
      hooks: {
        // save() (create, update) runs afterSave whichever it was: one hook for both
        afterSave: forgetOne,
        afterDestroy: forgetOne,
        afterUpsert: (_created, options) => forgetAll(options),
        afterBulkCreate: (_users, options) => forgetAll(options),
        afterBulkUpdate: forgetAll,
        afterBulkDestroy: forgetAll,
      },
    },
  );
  return User;
}
