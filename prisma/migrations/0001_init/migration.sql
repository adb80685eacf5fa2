-- CreateEnum
CREATE TYPE "Role" AS ENUM ('crew', 'scheduler', 'admin');

-- CreateEnum
CREATE TYPE "Position" AS ENUM ('captain', 'first_officer', 'flight_attendant', 'purser');

-- CreateEnum
CREATE TYPE "BidPeriodState" AS ENUM ('draft', 'open', 'closed', 'awarded', 'published');

-- CreateEnum
CREATE TYPE "ActivityKind" AS ENUM ('vacation', 'training', 'medical', 'office', 'other');

-- CreateEnum
CREATE TYPE "AwardRunState" AS ENUM ('queued', 'running', 'succeeded', 'failed', 'cancelled');

-- CreateEnum
CREATE TYPE "LineKind" AS ENUM ('line', 'reserve');

-- CreateTable
CREATE TABLE "Station" (
    "code" VARCHAR(4) NOT NULL,
    "name" TEXT NOT NULL,
    "zone" TEXT NOT NULL,
    "longitude" DOUBLE PRECISION NOT NULL,

    CONSTRAINT "Station_pkey" PRIMARY KEY ("code")
);

-- CreateTable
CREATE TABLE "Base" (
    "id" TEXT NOT NULL,
    "stationCode" VARCHAR(4) NOT NULL,
    "name" TEXT NOT NULL,

    CONSTRAINT "Base_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "CrewMember" (
    "id" TEXT NOT NULL,
    "employeeNumber" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "seniority" INTEGER NOT NULL,
    "baseId" TEXT NOT NULL,
    "position" "Position" NOT NULL,
    "qualifications" TEXT[],
    "carriedWeight" DOUBLE PRECISION NOT NULL DEFAULT 1,

    CONSTRAINT "CrewMember_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "User" (
    "id" TEXT NOT NULL,
    "email" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "passwordHash" TEXT NOT NULL,
    "role" "Role" NOT NULL,
    "crewMemberId" TEXT,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "User_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "BidPeriod" (
    "id" TEXT NOT NULL,
    "baseId" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "startDate" DATE NOT NULL,
    "endDate" DATE NOT NULL,
    "zone" TEXT NOT NULL,
    "opensAt" TIMESTAMPTZ(3) NOT NULL,
    "deadline" TIMESTAMPTZ(3) NOT NULL,
    "state" "BidPeriodState" NOT NULL DEFAULT 'draft',
    "closedAt" TIMESTAMPTZ(3),
    "publishedAt" TIMESTAMPTZ(3),
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "BidPeriod_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Pairing" (
    "id" TEXT NOT NULL,
    "bidPeriodId" TEXT NOT NULL,
    "code" TEXT NOT NULL,
    "startsAt" TIMESTAMPTZ(3) NOT NULL,
    "endsAt" TIMESTAMPTZ(3) NOT NULL,
    "blockMinutes" INTEGER NOT NULL,
    "creditMinutes" INTEGER NOT NULL,
    "tafbMinutes" INTEGER NOT NULL,
    "crewNeeded" JSONB NOT NULL,
    "requires" TEXT[],

    CONSTRAINT "Pairing_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "DutyPeriod" (
    "id" TEXT NOT NULL,
    "pairingId" TEXT NOT NULL,
    "seq" INTEGER NOT NULL,
    "reportAt" TIMESTAMPTZ(3) NOT NULL,
    "releaseAt" TIMESTAMPTZ(3) NOT NULL,

    CONSTRAINT "DutyPeriod_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Leg" (
    "id" TEXT NOT NULL,
    "dutyPeriodId" TEXT NOT NULL,
    "seq" INTEGER NOT NULL,
    "flightNumber" TEXT NOT NULL,
    "fromCode" VARCHAR(4) NOT NULL,
    "toCode" VARCHAR(4) NOT NULL,
    "departsAt" TIMESTAMPTZ(3) NOT NULL,
    "arrivesAt" TIMESTAMPTZ(3) NOT NULL,
    "deadhead" BOOLEAN NOT NULL DEFAULT false,
    "blockMinutes" INTEGER NOT NULL,
    "equipment" TEXT,

    CONSTRAINT "Leg_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "FixedActivity" (
    "id" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "kind" "ActivityKind" NOT NULL,
    "startsAt" TIMESTAMPTZ(3) NOT NULL,
    "endsAt" TIMESTAMPTZ(3) NOT NULL,
    "label" TEXT NOT NULL DEFAULT '',

    CONSTRAINT "FixedActivity_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "PastDuty" (
    "id" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "reportAt" TIMESTAMPTZ(3) NOT NULL,
    "releaseAt" TIMESTAMPTZ(3) NOT NULL,
    "flightMinutes" INTEGER NOT NULL,
    "segments" INTEGER NOT NULL,
    "endStation" VARCHAR(4),

    CONSTRAINT "PastDuty_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "CarryInTrip" (
    "id" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "pairingCode" TEXT NOT NULL,
    "dutyPeriods" JSONB NOT NULL,
    "startsAt" TIMESTAMPTZ(3) NOT NULL,
    "endsAt" TIMESTAMPTZ(3) NOT NULL,

    CONSTRAINT "CarryInTrip_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "DailyFlightTotal" (
    "crewMemberId" TEXT NOT NULL,
    "date" DATE NOT NULL,
    "minutes" INTEGER NOT NULL,

    CONSTRAINT "DailyFlightTotal_pkey" PRIMARY KEY ("crewMemberId","date")
);

-- CreateTable
CREATE TABLE "Bid" (
    "id" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "bidPeriodId" TEXT NOT NULL,
    "wishes" JSONB NOT NULL,
    "revision" INTEGER NOT NULL DEFAULT 0,
    "updatedAt" TIMESTAMPTZ(3) NOT NULL,

    CONSTRAINT "Bid_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "BidSubmission" (
    "id" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "bidPeriodId" TEXT NOT NULL,
    "revision" INTEGER NOT NULL,
    "wishes" JSONB NOT NULL,
    "hash" CHAR(64) NOT NULL,
    "receiptCode" TEXT NOT NULL,
    "submittedAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "BidSubmission_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "RuleSet" (
    "id" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "preset" TEXT NOT NULL,
    "document" JSONB NOT NULL,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMPTZ(3) NOT NULL,

    CONSTRAINT "RuleSet_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "AwardGroup" (
    "id" TEXT NOT NULL,
    "bidPeriodId" TEXT NOT NULL,
    "position" "Position" NOT NULL,
    "ruleSetId" TEXT NOT NULL,
    "settings" JSONB NOT NULL,
    "chosenRunId" TEXT,

    CONSTRAINT "AwardGroup_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "AwardRun" (
    "id" TEXT NOT NULL,
    "awardGroupId" TEXT NOT NULL,
    "state" "AwardRunState" NOT NULL DEFAULT 'queued',
    "progress" JSONB NOT NULL DEFAULT '{}',
    "settings" JSONB NOT NULL,
    "instance" JSONB NOT NULL,
    "instanceHash" CHAR(64) NOT NULL,
    "award" JSONB,
    "stats" JSONB,
    "error" TEXT,
    "jobId" TEXT,
    "requestedById" TEXT,
    "reviewedById" TEXT,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "startedAt" TIMESTAMPTZ(3),
    "finishedAt" TIMESTAMPTZ(3),

    CONSTRAINT "AwardRun_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "AwardedLine" (
    "id" TEXT NOT NULL,
    "awardRunId" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "kind" "LineKind" NOT NULL,
    "pairingCodes" TEXT[],
    "reserveDays" TEXT[],
    "creditMinutes" INTEGER NOT NULL,
    "score" DOUBLE PRECISION NOT NULL,
    "satisfaction" DOUBLE PRECISION NOT NULL,

    CONSTRAINT "AwardedLine_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Explanation" (
    "id" TEXT NOT NULL,
    "awardRunId" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "document" JSONB NOT NULL,

    CONSTRAINT "Explanation_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "FairnessEntry" (
    "id" TEXT NOT NULL,
    "crewMemberId" TEXT NOT NULL,
    "bidPeriodId" TEXT NOT NULL,
    "awardRunId" TEXT NOT NULL,
    "satisfaction" DOUBLE PRECISION NOT NULL,
    "balance" DOUBLE PRECISION NOT NULL,
    "carriedWeight" DOUBLE PRECISION NOT NULL,
    "createdAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "FairnessEntry_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "AuditEvent" (
    "id" TEXT NOT NULL,
    "at" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "actorUserId" TEXT,
    "action" TEXT NOT NULL,
    "entity" TEXT NOT NULL,
    "entityId" TEXT NOT NULL,
    "detail" JSONB NOT NULL DEFAULT '{}',

    CONSTRAINT "AuditEvent_pkey" PRIMARY KEY ("id")
);

-- CreateIndex
CREATE UNIQUE INDEX "Base_stationCode_key" ON "Base"("stationCode");

-- CreateIndex
CREATE UNIQUE INDEX "CrewMember_employeeNumber_key" ON "CrewMember"("employeeNumber");

-- CreateIndex
CREATE UNIQUE INDEX "CrewMember_seniority_key" ON "CrewMember"("seniority");

-- CreateIndex
CREATE INDEX "CrewMember_baseId_position_seniority_idx" ON "CrewMember"("baseId", "position", "seniority");

-- CreateIndex
CREATE UNIQUE INDEX "User_email_key" ON "User"("email");

-- CreateIndex
CREATE UNIQUE INDEX "User_crewMemberId_key" ON "User"("crewMemberId");

-- CreateIndex
CREATE INDEX "BidPeriod_state_idx" ON "BidPeriod"("state");

-- CreateIndex
CREATE UNIQUE INDEX "BidPeriod_baseId_startDate_key" ON "BidPeriod"("baseId", "startDate");

-- CreateIndex
CREATE INDEX "Pairing_bidPeriodId_startsAt_idx" ON "Pairing"("bidPeriodId", "startsAt");

-- CreateIndex
CREATE UNIQUE INDEX "Pairing_bidPeriodId_code_key" ON "Pairing"("bidPeriodId", "code");

-- CreateIndex
CREATE UNIQUE INDEX "DutyPeriod_pairingId_seq_key" ON "DutyPeriod"("pairingId", "seq");

-- CreateIndex
CREATE INDEX "Leg_fromCode_idx" ON "Leg"("fromCode");

-- CreateIndex
CREATE INDEX "Leg_toCode_idx" ON "Leg"("toCode");

-- CreateIndex
CREATE UNIQUE INDEX "Leg_dutyPeriodId_seq_key" ON "Leg"("dutyPeriodId", "seq");

-- CreateIndex
CREATE INDEX "FixedActivity_crewMemberId_startsAt_idx" ON "FixedActivity"("crewMemberId", "startsAt");

-- CreateIndex
CREATE INDEX "PastDuty_crewMemberId_reportAt_idx" ON "PastDuty"("crewMemberId", "reportAt");

-- CreateIndex
CREATE INDEX "CarryInTrip_crewMemberId_startsAt_idx" ON "CarryInTrip"("crewMemberId", "startsAt");

-- CreateIndex
CREATE INDEX "Bid_bidPeriodId_idx" ON "Bid"("bidPeriodId");

-- CreateIndex
CREATE UNIQUE INDEX "Bid_crewMemberId_bidPeriodId_key" ON "Bid"("crewMemberId", "bidPeriodId");

-- CreateIndex
CREATE UNIQUE INDEX "BidSubmission_receiptCode_key" ON "BidSubmission"("receiptCode");

-- CreateIndex
CREATE INDEX "BidSubmission_bidPeriodId_submittedAt_idx" ON "BidSubmission"("bidPeriodId", "submittedAt");

-- CreateIndex
CREATE UNIQUE INDEX "BidSubmission_crewMemberId_bidPeriodId_revision_key" ON "BidSubmission"("crewMemberId", "bidPeriodId", "revision");

-- CreateIndex
CREATE UNIQUE INDEX "RuleSet_name_key" ON "RuleSet"("name");

-- CreateIndex
CREATE UNIQUE INDEX "AwardGroup_chosenRunId_key" ON "AwardGroup"("chosenRunId");

-- CreateIndex
CREATE INDEX "AwardGroup_ruleSetId_idx" ON "AwardGroup"("ruleSetId");

-- CreateIndex
CREATE UNIQUE INDEX "AwardGroup_bidPeriodId_position_key" ON "AwardGroup"("bidPeriodId", "position");

-- CreateIndex
CREATE INDEX "AwardRun_awardGroupId_createdAt_idx" ON "AwardRun"("awardGroupId", "createdAt");

-- CreateIndex
CREATE INDEX "AwardRun_state_idx" ON "AwardRun"("state");

-- CreateIndex
CREATE INDEX "AwardedLine_crewMemberId_idx" ON "AwardedLine"("crewMemberId");

-- CreateIndex
CREATE UNIQUE INDEX "AwardedLine_awardRunId_crewMemberId_key" ON "AwardedLine"("awardRunId", "crewMemberId");

-- CreateIndex
CREATE INDEX "Explanation_crewMemberId_idx" ON "Explanation"("crewMemberId");

-- CreateIndex
CREATE UNIQUE INDEX "Explanation_awardRunId_crewMemberId_key" ON "Explanation"("awardRunId", "crewMemberId");

-- CreateIndex
CREATE INDEX "FairnessEntry_bidPeriodId_idx" ON "FairnessEntry"("bidPeriodId");

-- CreateIndex
CREATE INDEX "FairnessEntry_awardRunId_idx" ON "FairnessEntry"("awardRunId");

-- CreateIndex
CREATE UNIQUE INDEX "FairnessEntry_crewMemberId_bidPeriodId_key" ON "FairnessEntry"("crewMemberId", "bidPeriodId");

-- CreateIndex
CREATE INDEX "AuditEvent_entity_entityId_idx" ON "AuditEvent"("entity", "entityId");

-- CreateIndex
CREATE INDEX "AuditEvent_at_idx" ON "AuditEvent"("at");

-- AddForeignKey
ALTER TABLE "Base" ADD CONSTRAINT "Base_stationCode_fkey" FOREIGN KEY ("stationCode") REFERENCES "Station"("code") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "CrewMember" ADD CONSTRAINT "CrewMember_baseId_fkey" FOREIGN KEY ("baseId") REFERENCES "Base"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "User" ADD CONSTRAINT "User_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE SET NULL ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "BidPeriod" ADD CONSTRAINT "BidPeriod_baseId_fkey" FOREIGN KEY ("baseId") REFERENCES "Base"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Pairing" ADD CONSTRAINT "Pairing_bidPeriodId_fkey" FOREIGN KEY ("bidPeriodId") REFERENCES "BidPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "DutyPeriod" ADD CONSTRAINT "DutyPeriod_pairingId_fkey" FOREIGN KEY ("pairingId") REFERENCES "Pairing"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Leg" ADD CONSTRAINT "Leg_dutyPeriodId_fkey" FOREIGN KEY ("dutyPeriodId") REFERENCES "DutyPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Leg" ADD CONSTRAINT "Leg_fromCode_fkey" FOREIGN KEY ("fromCode") REFERENCES "Station"("code") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Leg" ADD CONSTRAINT "Leg_toCode_fkey" FOREIGN KEY ("toCode") REFERENCES "Station"("code") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "FixedActivity" ADD CONSTRAINT "FixedActivity_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "PastDuty" ADD CONSTRAINT "PastDuty_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "CarryInTrip" ADD CONSTRAINT "CarryInTrip_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "DailyFlightTotal" ADD CONSTRAINT "DailyFlightTotal_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Bid" ADD CONSTRAINT "Bid_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Bid" ADD CONSTRAINT "Bid_bidPeriodId_fkey" FOREIGN KEY ("bidPeriodId") REFERENCES "BidPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "BidSubmission" ADD CONSTRAINT "BidSubmission_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "BidSubmission" ADD CONSTRAINT "BidSubmission_bidPeriodId_fkey" FOREIGN KEY ("bidPeriodId") REFERENCES "BidPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardGroup" ADD CONSTRAINT "AwardGroup_bidPeriodId_fkey" FOREIGN KEY ("bidPeriodId") REFERENCES "BidPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardGroup" ADD CONSTRAINT "AwardGroup_ruleSetId_fkey" FOREIGN KEY ("ruleSetId") REFERENCES "RuleSet"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardGroup" ADD CONSTRAINT "AwardGroup_chosenRunId_fkey" FOREIGN KEY ("chosenRunId") REFERENCES "AwardRun"("id") ON DELETE SET NULL ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardRun" ADD CONSTRAINT "AwardRun_awardGroupId_fkey" FOREIGN KEY ("awardGroupId") REFERENCES "AwardGroup"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardRun" ADD CONSTRAINT "AwardRun_requestedById_fkey" FOREIGN KEY ("requestedById") REFERENCES "User"("id") ON DELETE SET NULL ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardRun" ADD CONSTRAINT "AwardRun_reviewedById_fkey" FOREIGN KEY ("reviewedById") REFERENCES "User"("id") ON DELETE SET NULL ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardedLine" ADD CONSTRAINT "AwardedLine_awardRunId_fkey" FOREIGN KEY ("awardRunId") REFERENCES "AwardRun"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AwardedLine" ADD CONSTRAINT "AwardedLine_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Explanation" ADD CONSTRAINT "Explanation_awardRunId_fkey" FOREIGN KEY ("awardRunId") REFERENCES "AwardRun"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Explanation" ADD CONSTRAINT "Explanation_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "FairnessEntry" ADD CONSTRAINT "FairnessEntry_crewMemberId_fkey" FOREIGN KEY ("crewMemberId") REFERENCES "CrewMember"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "FairnessEntry" ADD CONSTRAINT "FairnessEntry_bidPeriodId_fkey" FOREIGN KEY ("bidPeriodId") REFERENCES "BidPeriod"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "FairnessEntry" ADD CONSTRAINT "FairnessEntry_awardRunId_fkey" FOREIGN KEY ("awardRunId") REFERENCES "AwardRun"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AuditEvent" ADD CONSTRAINT "AuditEvent_actorUserId_fkey" FOREIGN KEY ("actorUserId") REFERENCES "User"("id") ON DELETE SET NULL ON UPDATE CASCADE;
