/** Reads for customers: the list with their open work at a glance, and one customer in full. */
import { asc, count, eq, like, or, sql } from "drizzle-orm";
import type { Db } from "../client";
import { customers, heads, jobs } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

const openJobsSql = sql<number>`(select count(*) from jobs j where j.customer_id = "customers"."id" and j.state in ('quoted','scheduled','on_machine','in_inspection'))`;
const jobsSql = sql<number>`(select count(*) from jobs j where j.customer_id = "customers"."id")`;
const headsSql = sql<number>`(select count(*) from heads h join jobs j on j.id = h.job_id where j.customer_id = "customers"."id")`;

const columns = {
  id: customers.id,
  name: customers.name,
  contactName: customers.contactName,
  email: customers.email,
  phone: customers.phone,
  openJobs: openJobsSql,
  jobs: jobsSql,
  heads: headsSql,
  createdAt: customers.createdAt,
};

export type CustomerRow = { id: number; name: string; contactName: string; email: string; phone: string; openJobs: number; jobs: number; heads: number; createdAt: number };

const sortable = { name: customers.name, contactName: customers.contactName, email: customers.email, openJobs: openJobsSql, jobs: jobsSql, heads: headsSql, createdAt: customers.createdAt };

export function listCustomers(db: Db, query: TableQuery): Page<CustomerRow> {
  const where = query.q
    ? or(like(customers.name, likePattern(query.q)), like(customers.contactName, likePattern(query.q)), like(customers.email, likePattern(query.q)))
    : undefined;
  const rows = db
    .select(columns)
    .from(customers)
    .where(where)
    .orderBy(...orderFor(query, sortable, "name"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(customers).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export type CustomerDetail = typeof customers.$inferSelect;

export function getCustomer(db: Db, id: number): CustomerDetail | null {
  return db.select().from(customers).where(eq(customers.id, id)).get() ?? null;
}

/** Every head the shop has had from or for this customer, with its job. */
export function customerHeads(db: Db, customerId: number) {
  return db
    .select({ id: heads.id, serial: heads.serial, castingNumber: heads.castingNumber, source: heads.source, state: heads.state, jobId: jobs.id, jobNumber: jobs.number })
    .from(heads)
    .innerJoin(jobs, eq(jobs.id, heads.jobId))
    .where(eq(jobs.customerId, customerId))
    .orderBy(asc(heads.serial))
    .all();
}

export function customerOptions(db: Db) {
  return db.select({ id: customers.id, name: customers.name }).from(customers).orderBy(asc(customers.name)).all();
}

