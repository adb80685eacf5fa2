-- AlterTable
ALTER TABLE "AwardRun" ADD COLUMN     "preview" BOOLEAN NOT NULL DEFAULT false;
