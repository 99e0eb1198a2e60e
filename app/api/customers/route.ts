import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listCustomers } from "@/db/queries/customers";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { createCustomer } from "@/lib/jobs/customers";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/customers?page&pageSize&sort&dir&q — everyone signed in reads. */
export const GET = apiRoute(EVERYONE, async ({ req }) => listCustomers(db(), parseInput(tableQuerySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/customers { name, contactName?, email?, phone?, address?, notes? } — lead, admin. */
export const POST = apiRoute(LEADS, async ({ req, actor }) => NextResponse.json(createCustomer(db(), actor, await jsonBody(req)), { status: 201 }));
