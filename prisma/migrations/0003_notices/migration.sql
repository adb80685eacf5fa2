-- CreateEnum
CREATE TYPE "NoticeKind" AS ENUM ('bidding_opened', 'deadline_extended', 'closed_early', 'award_published', 'award_corrected');

-- CreateTable
CREATE TABLE "Notice" (
    "id" TEXT NOT NULL,
    "bidPeriodId" TEXT NOT NULL,
    "kind" "NoticeKind" NOT NULL,
    "text" TEXT NOT NULL,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "Notice_pkey" PRIMARY KEY ("id")
);

-- CreateIndex
CREATE INDEX "Notice_bidPeriodId_createdAt_idx" ON "Notice"("bidPeriodId", "createdAt");

-- AddForeignKey
ALTER TABLE "Notice" ADD CONSTRAINT "Notice_bidPeriodId_fkey" FOREIGN KEY ("bidPeriodId") REFERENCES "BidPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;
