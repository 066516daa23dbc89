import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/**
 * A library study offered to a published verdict's authors as new evidence for one of its
 * mechanisms. Never applied by itself; the authors read it or dismiss it (lib/watch/suggestions.ts).
 */
export class EvidenceSuggestion extends Model<
  InferAttributes<EvidenceSuggestion>,
  InferCreationAttributes<EvidenceSuggestion>
> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare publicationId: number;
  declare mechanismId: number;
  declare studyId: number;
  declare score: number;
  declare reason: string;
  declare dismissedAt: Date | null;
  declare dismissedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

EvidenceSuggestion.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    publicationId: { type: DataTypes.INTEGER, allowNull: false },
    mechanismId: { type: DataTypes.INTEGER, allowNull: false },
    studyId: { type: DataTypes.INTEGER, allowNull: false },
    score: { type: DataTypes.FLOAT, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false },
    dismissedAt: { type: DataTypes.DATE, allowNull: true },
    dismissedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: { type: DataTypes.DATE },
    updatedAt: { type: DataTypes.DATE },
  },
  { sequelize: db(), modelName: 'EvidenceSuggestion', tableName: 'evidence_suggestions' },
);
