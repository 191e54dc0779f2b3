import type { Sequelize } from 'sequelize';
import { Organization } from './organization';
import { User } from './user';
import { Membership } from './membership';
import { RefreshToken } from './refresh-token';
import { Client } from './client';
import { Device } from './device';
import { Instrument } from './instrument';
import { RuleSet } from './rule-set';
import { TestPlan } from './test-plan';
import { TestCase } from './test-case';
import { TestRun } from './test-run';
import { Reading } from './reading';
import { Result } from './result';
import { Report } from './report';
import { ReportStatusChange } from './report-status-change';
import { AuditEntry } from './audit-entry';
import { SigningIdentity } from './signing-identity';
import { RunInstrument } from './run-instrument';
import { Invitation } from './invitation';
import { ApiKey } from './api-key';
import { AuditorGrant } from './auditor-grant';
import { PasswordReset } from './password-reset';
import { RunComment } from './run-comment';

export { Organization, User, Membership, RefreshToken, Client, Device, Instrument, RuleSet, TestPlan, TestCase, TestRun, Reading, Result, Report, ReportStatusChange, AuditEntry, SigningIdentity, RunInstrument, Invitation, ApiKey, AuditorGrant, PasswordReset, RunComment };

/** Initialise every model on one Sequelize instance (call once at start-up). */
export function initModels(sequelize: Sequelize): void {
  Organization.initModel(sequelize);
  User.initModel(sequelize);
  Membership.initModel(sequelize);
  RefreshToken.initModel(sequelize);
  Client.initModel(sequelize);
  Device.initModel(sequelize);
  Instrument.initModel(sequelize);
  RuleSet.initModel(sequelize);
  TestPlan.initModel(sequelize);
  TestCase.initModel(sequelize);
  TestRun.initModel(sequelize);
  Reading.initModel(sequelize);
  Result.initModel(sequelize);
  Report.initModel(sequelize);
  ReportStatusChange.initModel(sequelize);
  AuditEntry.initModel(sequelize);
  SigningIdentity.initModel(sequelize);
  RunInstrument.initModel(sequelize);
  Invitation.initModel(sequelize);
  ApiKey.initModel(sequelize);
  AuditorGrant.initModel(sequelize);
  PasswordReset.initModel(sequelize);
  RunComment.initModel(sequelize);
}
