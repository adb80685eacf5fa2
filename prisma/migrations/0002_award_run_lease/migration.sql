-- AlterTable
ALTER TABLE "AwardRun" ADD COLUMN     "cancelRequestedAt" TIMESTAMPTZ(3),
ADD COLUMN     "leaseUntil" TIMESTAMPTZ(3);
